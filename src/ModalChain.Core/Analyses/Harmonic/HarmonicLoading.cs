using System.Numerics;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Harmonic;

/// <summary>A set of loads compiled into fixed vectors whose combination gives the right-hand side at any frequency.</summary>
/// <remarks>
/// The free right-hand side is b(ω) = Σ_r (iω)^{p_r} b_r and each support moves as u_s(ω) = Σ (iω)^{q} U. A force
/// contributes F e^{iφ} with p = 0; an unbalance m·e·ω² = −m·e·(iω)², p = 2; a prescribed support motion U moves the
/// free DOFs through −(K(1+iη)_fp + iω C_fp + (iω)² M_fp) U (Chopra, Dynamics of Structures, §9.6 on multi-support
/// excitation; M_fp is the inertance of inerters with an end on the support).
/// In plane and 3d models a load enters through its attachment map as Tᵀ e_d F (<see cref="SpatialLoads"/>): a
/// force at a body point also gives its moment about the centre of mass, an unbalance in the plane (d₁, d₂) has
/// amplitudes A along d₁ and −iA along d₂ (cos and sin, 90° apart), and a support motion in direction d moves the
/// prescribed column (support, d) of the partition.
/// </remarks>
internal sealed class HarmonicLoading
{
    public const int MinPower = -2;
    public const int MaxPower = 3;

    public List<(Complex[] Vector, int Power)> Terms { get; } = [];

    /// <summary>Support motion terms: support index, complex amplitude in m, power of iω.</summary>
    public List<(int Support, Complex Amplitude, int Power)> SupportMotion { get; } = [];

    /// <summary>Applied force terms at free DOFs (for the force transmissibility): amplitude in N and power of iω.</summary>
    public List<(Complex Amplitude, int Power)> AppliedForces { get; } = [];

    public static HarmonicLoading Compile(DampedSystem system, IReadOnlyList<Load> loads)
    {
        var p = system.Partition;
        var n = p.FreeCount;
        var eta = system.LossFactor;
        var network = system.Model.Network;
        var spatial = network.Space != ModelSpace.Line;
        var loading = new HarmonicLoading();
        foreach (var load in loads)
        {
            switch (load)
            {
                case ForceLoad f when spatial:
                {
                    var a = Complex.FromPolarCoordinates(f.Amplitude, f.Phase);
                    loading.Terms.Add((Spread(n, SpatialLoads.UnitLoad(network, p.Free, f.At, f.Direction, f.Name), a), 0));
                    loading.AppliedForces.Add((a, 0));
                    break;
                }
                case UnbalanceLoad u when spatial:
                {
                    // m·e·ω² cos(ωt + φ) along the first direction and sin(ωt + φ) along the second: amplitudes A and −iA.
                    if (u.Plane.Length != 2 || u.Plane[0] == u.Plane[1])
                        throw new ArgumentException($"Unbalance '{u.Name}' needs a plane of two different translations in a plane or 3d model.", nameof(loads));
                    var a = -Complex.FromPolarCoordinates(u.MassRadius, u.Phase);
                    var v = Spread(n, SpatialLoads.UnitLoad(network, p.Free, u.At, u.Plane[0], u.Name), a);
                    foreach (var (i, w) in SpatialLoads.UnitLoad(network, p.Free, u.At, u.Plane[1], u.Name)) v[i] += -Complex.ImaginaryOne * a * w;
                    loading.Terms.Add((v, 2));
                    loading.AppliedForces.Add((a, 2));
                    break;
                }
                case ForceLoad f:
                {
                    var a = Complex.FromPolarCoordinates(f.Amplitude, f.Phase);
                    loading.Terms.Add((Unit(n, Index(p, f.At, f.Name), a), 0));
                    loading.AppliedForces.Add((a, 0));
                    break;
                }
                case UnbalanceLoad u:
                {
                    var a = -Complex.FromPolarCoordinates(u.MassRadius, u.Phase);
                    loading.Terms.Add((Unit(n, Index(p, u.At, u.Name), a), 2));
                    loading.AppliedForces.Add((a, 2));
                    break;
                }
                case BaseMotionLoad b:
                {
                    if (b.Support == Network.Ground) throw new ArgumentException($"Load '{b.Name}' moves ground, which is fixed.", nameof(loads));
                    var s = spatial || b.Direction != Direction.Along
                        ? SpatialLoads.SupportColumn(p, network.Space, b.Support, b.Direction, b.Name)
                        : p.SupportIndex(b.Support);
                    if (s < 0) throw new ArgumentException($"Load '{b.Name}' moves unknown support '{b.Support}'.", nameof(loads));
                    var q = b.Kind switch { BaseMotionKind.Displacement => 0, BaseMotionKind.Velocity => -1, _ => -2 };
                    var amplitude = Complex.FromPolarCoordinates(b.Amplitude, b.Phase);
                    loading.SupportMotion.Add((s, amplitude, q));
                    var stiff = new Complex[n];
                    var damp = new Complex[n];
                    var k = new Complex(1, eta);
                    for (var i = 0; i < n; i++)
                    {
                        stiff[i] = -k * p.StiffnessFP[i, s] * amplitude;
                        damp[i] = -system.Damping.FP[i, s] * amplitude;
                    }
                    loading.Terms.Add((stiff, q));
                    loading.Terms.Add((damp, q + 1));
                    if (p.HasInertialCoupling)
                    {
                        // An inerter from the support to a free DOF: −M_fp ü_p = −(iω)² M_fp U.
                        var inertial = new Complex[n];
                        for (var i = 0; i < n; i++) inertial[i] = -p.MassFP[i, s] * amplitude;
                        if (inertial.Any(v => v != Complex.Zero)) loading.Terms.Add((inertial, q + 2));
                    }
                    break;
                }
                default:
                    throw new ArgumentException($"Load '{load.Name}' of kind {load.GetType().Name} has no harmonic form.", nameof(loads));
            }
        }
        return loading;
    }

    /// <summary>Fills <paramref name="powers"/> with (iω)^k for k = MinPower..MaxPower (index k − MinPower).</summary>
    public static void Powers(double omega, Span<Complex> powers)
    {
        var iw = new Complex(0, omega);
        powers[-MinPower] = Complex.One;
        for (var k = 1; k <= MaxPower; k++) powers[k - MinPower] = powers[k - 1 - MinPower] * iw;
        for (var k = -1; k >= MinPower; k--) powers[k - MinPower] = powers[k + 1 - MinPower] / iw;
    }

    private static int Index(SupportPartition p, string mass, string load)
    {
        var i = p.Free.IndexOf(mass);
        if (i < 0) throw new ArgumentException($"Load '{load}' acts at '{mass}', which is not a mass of the network.", nameof(mass));
        return i;
    }

    /// <summary>The vector a·w over <paramref name="n"/> DOFs from a distribution w (Tᵀ e_d of a spatial load).</summary>
    private static Complex[] Spread(int n, (int Dof, double Weight)[] distribution, Complex a)
    {
        var v = new Complex[n];
        foreach (var (i, w) in distribution) v[i] += a * w;
        return v;
    }

    private static Complex[] Unit(int n, int i, Complex a)
    {
        var v = new Complex[n];
        v[i] = a;
        return v;
    }
}
