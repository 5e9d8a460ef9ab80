using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Model;
using ModalChain.TestSupport;

namespace ModalChain.Io.Tests.Model;

/// <summary>The 'supports', 'damping', 'loads' and 'harmonic' sections: values to SI, and every bad input at its line and column.</summary>
public class HarmonicSectionsTests
{
    private const string Network = """
        masses:
          deck: {mass: 3200 kg}
          skid: {mass: 850 kg}
        supports:
          plinth: {at: [0, -1]}
        springs:
          columns: {between: [ground, deck], stiffness: 95 kN/mm}
          mounts: {between: [deck, skid], stiffness: 8.4 kN/mm}
          pad: {between: [plinth, skid], stiffness: 1 kN/mm}

        """;

    private static LoadResult Read(string text) => ModelReader.Read(text, "case.yaml");

    /// <summary>Asserts exactly one error, at the 1-based line and column of the first occurrence of <paramref name="token"/> on line <paramref name="line"/>.</summary>
    private static void AssertSingleErrorAt(string text, int line, string token, string messagePart)
    {
        var result = Read(text);
        Assert.False(result.Succeeded);
        var error = Assert.Single(result.Errors);
        var lines = text.Split('\n');
        var column = lines[line - 1].IndexOf(token, StringComparison.Ordinal) + 1;
        Assert.True(column > 0, $"token '{token}' not on line {line}");
        Assert.Equal(new SourcePosition(line, column), error.Position);
        Assert.Contains(messagePart, error.Message);
        Assert.StartsWith($"case.yaml:{line}:{column}: error: ", error.ToString());
    }

    [Fact]
    public void FullModel_IsReadInSi()
    {
        // Unit factors are exact by definition (1 g·mm = 1e-6 kg·m, 1 rpm = 1/60 Hz, g = 9.80665 m/s²); Rayleigh targets by
        // a0 = 2ζω1ω2/(ω1+ω2), a1 = 2ζ/(ω1+ω2) (Chopra §11.4 [from memory]). Tolerance 1e-12 rel.
        var text = Network + """
            damping:
              rayleigh: {ratio: 2 %, at: [4 Hz, 30 Hz]}
              loss-factor: 0.01
            loads:
              rotor: {kind: unbalance, at: skid, mass-radius: 12000 g*mm, speed: 1480 rpm, phase: 90 deg}
              tap: {kind: force, at: deck, amplitude: 2 kN}
              floor: {kind: base-motion, support: plinth, acceleration: 0.05 g}
            harmonic:
              loads: [rotor, floor]
              frequencies: {from: 1 Hz, to: 60 Hz, points: 600, spacing: log}
              refine: false
              outputs: [skid]
              method: modal
              modes: 2
            """;
        var result = Read(text);
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var model = result.Model!.Structure;
        Assert.Equal(["ground", "plinth"], model.Network.Supports.Select(s => s.Name));
        var rotor = Assert.IsType<UnbalanceLoad>(model.FindLoad("rotor"));
        NumericAssert.Close(0.012, rotor.MassRadius, Tolerance.Rel(1e-12), "m·e [kg·m]");
        NumericAssert.Close(1480.0 / 60, rotor.SpeedHz!.Value, Tolerance.Rel(1e-12), "speed [Hz]");
        NumericAssert.Close(Math.PI / 2, rotor.Phase, Tolerance.Rel(1e-12), "phase [rad]");
        NumericAssert.Close(2000, Assert.IsType<ForceLoad>(model.FindLoad("tap")).Amplitude, Tolerance.Rel(1e-12), "force [N]");
        var floor = Assert.IsType<BaseMotionLoad>(model.FindLoad("floor"));
        Assert.Equal(BaseMotionKind.Acceleration, floor.Kind);
        NumericAssert.Close(0.05 * 9.80665, floor.Amplitude, Tolerance.Rel(1e-12), "acceleration [m/s²]");
        double w1 = 2 * Math.PI * 4, w2 = 2 * Math.PI * 30;
        NumericAssert.Close(2 * 0.02 * w1 * w2 / (w1 + w2), model.Damping.Rayleigh!.MassCoefficient, Tolerance.Rel(1e-12), "a0");
        NumericAssert.Close(2 * 0.02 / (w1 + w2), model.Damping.Rayleigh.StiffnessCoefficient, Tolerance.Rel(1e-12), "a1");
        NumericAssert.Close(0.01, model.Damping.LossFactor, Tolerance.Rel(1e-12), "η");
        var spec = result.Model.Harmonic!;
        Assert.Equal(["rotor", "floor"], spec.Loads.ToArray());
        Assert.Equal(new FrequencyRange(1, 60, 600, FrequencySpacing.Logarithmic), spec.Frequencies);
        Assert.False(spec.Refine);
        Assert.Equal(["skid"], spec.Outputs.ToArray());
        Assert.Equal(HarmonicMethod.Modal, spec.Method);
        Assert.Equal(2, spec.ModeCount);
    }

    [Fact]
    public void ModalList_AndCoefficientRayleigh_AndExplicitFrequencies_AreRead()
    {
        var modal = Read(Network + "damping:\n  modal: [2 %, 3 %, 0.05]\nloads:\n  f: {kind: force, at: deck, amplitude: 1 N}\nharmonic:\n  frequencies: [24.7 Hz, 12 Hz, 1480 rpm]\n");
        Assert.True(modal.Succeeded, string.Join("\n", modal.Diagnostics));
        NumericAssert.Close([0.02, 0.03, 0.05], modal.Model!.Structure.Damping.ModalRatios, Tolerance.Rel(1e-12), "ratios");
        var list = Assert.IsType<FrequencyList>(modal.Model.Harmonic!.Frequencies);
        NumericAssert.Close([24.7, 12, 1480.0 / 60], list.FrequenciesHz, Tolerance.Rel(1e-12), "explicit frequencies in order");
        Assert.True(modal.Model.Harmonic.Loads.IsEmpty, "default: all loads");

        var coefficients = Read(Network + "damping:\n  rayleigh: {mass: 0.3, stiffness: 0.0004 s}\n");
        Assert.True(coefficients.Succeeded, string.Join("\n", coefficients.Diagnostics));
        Assert.Equal(new RayleighDamping(0.3, 0.0004), coefficients.Model!.Structure.Damping.Rayleigh);
    }

    [Fact]
    public void LoadAtUnknownMass_IsAnErrorAtItsName() =>
        AssertSingleErrorAt(Network + "loads:\n  rotor: {kind: unbalance, at: skd, mass-radius: 1 kg*mm}\n", 11, "skd", "unknown mass 'skd' (did you mean 'skid'?)");

    [Fact]
    public void BaseMotionOnGround_IsAnError() =>
        AssertSingleErrorAt(Network + "loads:\n  quake: {kind: base-motion, support: ground, acceleration: 0.1 g}\n", 11, "ground", "moves 'ground', which is fixed");

    [Fact]
    public void SweepFromAboveTo_IsAnErrorAtTo() =>
        AssertSingleErrorAt(Network + "loads:\n  f: {kind: force, at: deck, amplitude: 1 N}\nharmonic:\n  frequencies: {from: 60 Hz, to: 60 Hz, points: 10}\n",
            13, "60 Hz, points", "must be above 'from'");

    [Fact]
    public void SweepWithZeroPoints_IsAnError() =>
        AssertSingleErrorAt(Network + "loads:\n  f: {kind: force, at: deck, amplitude: 1 N}\nharmonic:\n  frequencies: {from: 1 Hz, to: 60 Hz, points: 0}\n",
            13, "0}", "'points' of 'frequencies' of 'harmonic' must be a whole number from 2");

    [Fact]
    public void NegativeDampingRatio_IsAnError() =>
        AssertSingleErrorAt(Network + "damping:\n  modal: [2 %, -3 %]\n", 11, "-3 %", "a damping ratio cannot be negative");

    [Fact]
    public void NegativeRayleighTargetRatio_IsAnError() =>
        AssertSingleErrorAt(Network + "damping:\n  rayleigh: {ratio: -1 %, at: [4 Hz, 30 Hz]}\n", 11, "-1 %", "cannot be negative");

    [Fact]
    public void SpringToUndeclaredSupport_IsAnError() =>
        AssertSingleErrorAt(Network.Replace("[plinth, skid]", "[plinht, skid]"), 9, "plinht", "unknown node 'plinht' (did you mean 'plinth'?)");

    [Fact]
    public void UnknownOutputAndLoad_InHarmonic_AreErrors()
    {
        var text = Network + "loads:\n  f: {kind: force, at: deck, amplitude: 1 N}\nharmonic:\n  loads: [g]\n  outputs: [deck, skidd]\n  frequencies: [10 Hz]\n  method: modl\n";
        var result = Read(text);
        var errors = result.Errors.ToArray();
        Assert.Equal(3, errors.Length);
        Assert.Equal(new SourcePosition(13, 11), errors[0].Position);
        Assert.Contains("unknown load 'g'", errors[0].Message);
        Assert.Equal(new SourcePosition(14, 19), errors[1].Position);
        Assert.Contains("unknown mass 'skidd' (did you mean 'skid'?)", errors[1].Message);
        Assert.Equal(new SourcePosition(16, 11), errors[2].Position);
        Assert.Contains("'modl' (did you mean 'modal'?)", errors[2].Message);
    }

    [Fact]
    public void EveryProblem_IsReportedAtOnce()
    {
        var text = Network + """
            damping:
              modal: -2 %
            loads:
              a: {kind: force, at: nowhere, amplitude: 1 N}
              b: {kind: base-motion, support: ground, velocity: 1 mm/s}
              c: {kind: shove, at: deck}
            harmonic:
              frequencies: {from: 0 Hz, to: 10 Hz}
            """;
        var result = Read(text);
        Assert.False(result.Succeeded);
        Assert.Equal([11, 13, 14, 15, 17], result.Errors.Select(e => e.Position.Line));
    }
}
