using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Analyses.Studies;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Studies;

/// <summary>Parameter studies on 3d models: per-direction paths, mode tracking by the full-M MAC, motion names, thresholds.</summary>
/// <remarks>
/// The model is the symmetric block on four mounts of REFERENCES.md §10 (Harris, theory of vibration isolation [from
/// memory]; the matrices follow from the rigid-body transformation) with the mounts in the plane of the centre of mass
/// (h = 0), where the six motions decouple: ω² = 4k_x/m (surge), 4k_y/m (sway), 4k_z/m (bounce), 4k_z b²/J_x (roll),
/// 4k_z a²/J_y (pitch) and 4(k_x b² + k_y a²)/J_z (yaw). k_x ≠ k_y keeps surge and sway apart.
/// </remarks>
public class SpatialStudyTests
{
    private const double Mass = 1200, A = 0.8, B = 0.5, Kx = 3e5, Ky = 2e5, Kz = 9e5;
    private static readonly InertiaMatrix Inertia = new(250, 400, 520);

    private static Network Block(double kz = Kz)
    {
        var builder = new NetworkBuilder { Space = ModelSpace.ThreeD, Title = "block on four mounts" };
        var corners = new[] { (1, 1), (1, -1), (-1, 1), (-1, -1) };
        builder.AddBody(new RigidBody("block", Mass, new Point3(0, 0, 0), Inertia,
            [.. corners.Select((c, i) => new BodyPoint($"foot-{i + 1}", new Point3(c.Item1 * A, c.Item2 * B, 0)))]));
        for (var i = 1; i <= 4; i++)
            builder.AddSpring(new Spring($"mount-{i}", $"block.foot-{i}", Network.Ground, kz)
            {
                Components = [new(Direction.X, Kx), new(Direction.Y, Ky), new(Direction.Z, kz)],
            });
        return builder.Build();
    }

    /// <summary>ω² of each motion from the closed forms above, for mount stiffness k_z and block mass m.</summary>
    private static Dictionary<string, double> Closed(double kz = Kz, double mass = Mass) => new()
    {
        ["surge"] = 4 * Kx / mass,
        ["sway"] = 4 * Ky / mass,
        ["bounce"] = 4 * kz / mass,
        ["roll"] = 4 * kz * B * B / Inertia.Xx,
        ["pitch"] = 4 * kz * A * A / Inertia.Yy,
        ["yaw"] = 4 * (Kx * B * B + Ky * A * A) / Inertia.Zz,
    };

    private static double Hz(double omega2) => Math.Sqrt(omega2) / (2 * Math.PI);

    private static ParameterPath Path(string text, Network network)
    {
        var path = ParameterPath.Resolve(text, network, out var error);
        Assert.True(path is not null, error);
        return path!;
    }

    [Fact]
    public void TheModelIsTheClosedForm()
    {
        var modes = ModalAnalysis.Solve(Block()).Modes;
        foreach (var (motion, omega2) in Closed())
            NumericAssert.Close(Hz(omega2), modes.Single(m => m.Motion == motion).NaturalFrequencyHz, Tolerance.Rel(1e-10), motion);
    }

    [Theory]
    [InlineData(0.25)]
    [InlineData(0.5)]
    [InlineData(2.0)]
    [InlineData(4.0)]
    public void VerticalStiffnessOfAllFourMountsTimesS_ScalesBounceRollPitchByRootS_AndLeavesTheHorizontalModes(double s)
    {
        // REFERENCES.md §10 closed forms: bounce, roll and pitch carry k_z (×√s in frequency); surge, sway and yaw
        // carry only the horizontal stiffness, which a per-direction path leaves alone.
        var network = Block();
        for (var i = 1; i <= 4; i++) network = Path($"springs.mount-{i}.stiffness.z", network).Apply(network, s * Kz);
        var modes = ModalAnalysis.Solve(network).Modes;
        var before = Closed();
        foreach (var motion in new[] { "bounce", "roll", "pitch" })
            NumericAssert.Close(Math.Sqrt(s) * Hz(before[motion]), modes.Single(m => m.Motion == motion).NaturalFrequencyHz, Tolerance.Rel(1e-10), $"{motion} × √{s}");
        foreach (var motion in new[] { "surge", "sway", "yaw" })
            NumericAssert.Close(Hz(before[motion]), modes.Single(m => m.Motion == motion).NaturalFrequencyHz, Tolerance.Rel(1e-10), $"{motion} unchanged");
        Assert.All(network.Springs, spring =>
        {
            Assert.Equal(new DirectionalValue[] { new(Direction.X, Kx), new(Direction.Y, Ky), new(Direction.Z, s * Kz) }, spring.Components);
            Assert.Equal(Math.Max(Kx, s * Kz), spring.Stiffness); // the scale stays the largest translational value
        });
    }

    [Fact]
    public void WholeSpringStiffnessTimesS_ScalesEveryFrequencyByRootS()
    {
        // Identity: every component × s makes K → sK, so every ω → √s ω.
        const double s = 2.5;
        var network = Block();
        for (var i = 1; i <= 4; i++)
        {
            var path = Path($"springs.mount-{i}.stiffness", network);
            Assert.Equal(Kz, path.Get(network)); // the scale: the largest translational component
            network = path.Apply(network, s * Kz);
        }
        var before = ModalAnalysis.Solve(Block()).Modes.Select(m => m.NaturalFrequencyHz).ToArray();
        var after = ModalAnalysis.Solve(network).Modes.Select(m => m.NaturalFrequencyHz).ToArray();
        NumericAssert.Close(before.Select(f => Math.Sqrt(s) * f).ToArray(), after, Tolerance.Rel(1e-10), "ω × √s");
    }

    [Fact]
    public void OneMountsVerticalStiffness_LeavesTheHorizontalModes_AndMovesTheVerticalOnesByTheTrace()
    {
        // With h = 0 the vertical springs act on z, rx, ry only, so surge, sway and yaw keep their closed forms at every
        // step whatever one mount's k_z (closed form). For the z–rx–ry trio, Σω² = tr(M⁻¹K) = Σk_z,i (1/m + b²/J_x + a²/J_y)
        // (identity: the trace of M⁻¹K is the sum of its eigenvalues; M is diagonal here).
        var network = Block();
        var request = new StudyRequest(Path("springs.mount-1.stiffness.z", network), 0.2 * Kz, 3 * Kz, 15, StudySpacing.Linear, []);
        var result = ParameterStudy.Run(network, request);
        var closed = Closed();
        TrackedMode Named(string motion) => result.Modes.Single(m => m.Motions[0] == motion);
        foreach (var motion in new[] { "surge", "sway", "yaw" })
        {
            var mode = Named(motion);
            Assert.All(mode.FrequenciesHz, (f, s) => NumericAssert.Close(Hz(closed[motion]), f, Tolerance.Rel(1e-10), $"{motion} at step {s}"));
            Assert.All(mode.Motions, m => Assert.Equal(motion, m));
        }
        var trio = result.Modes.Where(m => m.Motions[0] is not ("surge" or "sway" or "yaw")).ToArray();
        Assert.Equal(3, trio.Length);
        for (var s = 0; s < result.Steps.Length; s++)
        {
            var kz1 = result.Steps[s].Value;
            var trace = (3 * Kz + kz1) * (1 / Mass + B * B / Inertia.Xx + A * A / Inertia.Yy);
            var sum = trio.Sum(m => Math.Pow(2 * Math.PI * m.FrequenciesHz[s], 2));
            NumericAssert.Close(trace, sum, Tolerance.Rel(1e-10), $"Σω² of the vertical trio at step {s}");
        }
    }

    [Fact]
    public void BodyMassStudy_FollowsBounceThroughItsCrossingsWithRollPitchAndYaw()
    {
        // bodies.block.mass keeps the inertia: bounce ω² = 4k_z/m falls through pitch (at m = 625 kg), roll (1000 kg) and
        // yaw (2305 kg), which stay put; surge and sway fall too and surge crosses yaw (768.5 kg). No step lands on a
        // crossing. The decoupled motions are M-orthogonal, so the full-M MAC keeps every identity (closed form, §10).
        var network = Block();
        var path = Path("bodies.block.mass", network);
        Assert.Equal(ModalChain.Core.Units.Quantity.Mass, path.Quantity);
        var result = ParameterStudy.Run(network, new StudyRequest(path, 600, 2400, 13, StudySpacing.Geometric, []));
        foreach (var mode in result.Modes)
        {
            var motion = mode.Motions[0];
            Assert.All(mode.Motions, m => Assert.Equal(motion, m));
            Assert.True(mode.WorstMac > 0.999999, $"{motion}: MAC {mode.WorstMac}");
            for (var s = 0; s < result.Steps.Length; s++)
                NumericAssert.Close(Hz(Closed(mass: result.Steps[s].Value)[motion]), mode.FrequenciesHz[s], Tolerance.Rel(1e-10), $"{motion} at {result.Steps[s].Value:G6} kg");
        }
        var bounce = result.Modes.Single(m => m.Motions[0] == "bounce");
        Assert.Equal(6, bounce.ModeNumbers[0]);   // above pitch at 600 kg
        Assert.Equal(3, bounce.ModeNumbers[^1]);  // below yaw, roll and pitch at 2400 kg; above sway and surge
        Assert.Equal(Inertia, path.Apply(network, 2000).Bodies.Single().Inertia);
    }

    [Fact]
    public void SeparationThresholds_AreWhereBounceMeetsTheBandEdges()
    {
        // Separation ±5 % of 7 Hz: bounce f = √(4k_z/m)/2π is inside (6.65, 7.35) Hz for 4k_z/(2π·7.35)² < m < 4k_z/(2π·6.65)²
        // (closed form); no other mode comes near the band over 1500–2400 kg.
        var network = Block();
        var criterion = StudyCriterion.Separation(new SeparationCriterion(0.05, [7.0], [1.0]));
        var result = ParameterStudy.Run(network, new StudyRequest(Path("bodies.block.mass", network), 1500, 2400, 10, StudySpacing.Linear, [criterion]));
        Assert.Equal(2, result.Thresholds.Length);
        NumericAssert.Close(4 * Kz / Math.Pow(2 * Math.PI * 7.35, 2), result.Thresholds[0].Value, Tolerance.Rel(1e-8), "stops passing where bounce falls to 7.35 Hz");
        Assert.False(result.Thresholds[0].PassesAbove);
        NumericAssert.Close(4 * Kz / Math.Pow(2 * Math.PI * 6.65, 2), result.Thresholds[1].Value, Tolerance.Rel(1e-8), "starts passing where bounce falls to 6.65 Hz");
        Assert.True(result.Thresholds[1].PassesAbove);
    }
}
