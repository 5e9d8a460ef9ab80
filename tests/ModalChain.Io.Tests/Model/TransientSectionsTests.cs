using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Model;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Model;
using ModalChain.TestSupport;

namespace ModalChain.Io.Tests.Model;

/// <summary>Timed loads, the 'transient' section and table files: values to SI, and every bad input at its line and column.</summary>
public sealed class TransientSectionsTests : IDisposable
{
    private const string Network = """
        masses:
          deck: {mass: 3200 kg}
          skid: {mass: 850 kg}
        supports:
          slab: {}
        springs:
          columns: {between: [ground, deck], stiffness: 95 kN/mm}
          mounts: {between: [deck, skid], stiffness: 8.4 kN/mm}
          pad: {between: [slab, skid], stiffness: 1 kN/mm}

        """;

    private readonly string _directory = Directory.CreateTempSubdirectory("modalchain-transient-").FullName;

    public void Dispose() => Directory.Delete(_directory, recursive: true);

    private LoadResult Read(string text) => ModelReader.Read(text, Path.Combine(_directory, "case.yaml"));

    private void Table(string name, string text) => File.WriteAllText(Path.Combine(_directory, name), text);

    private void AssertSingleErrorAt(string text, int line, string token, string messagePart)
    {
        var result = Read(text);
        Assert.False(result.Succeeded);
        var error = Assert.Single(result.Errors);
        var column = text.Split('\n')[line - 1].IndexOf(token, StringComparison.Ordinal) + 1;
        Assert.True(column > 0, $"token '{token}' not on line {line}");
        Assert.Equal(new SourcePosition(line, column), error.Position);
        Assert.Contains(messagePart, error.Message);
    }

    [Fact]
    public void TimedLoadsAndRun_AreReadInSi()
    {
        // Unit factors are exact by definition: 1 rpm = 2π/60 rad/s, 1 g·m = 1e-3 kg·m, 1 g = 9.80665 m/s², 1 ms = 1e-3 s.
        Table("hammer.csv", "time,force\n0,0\n0.001,2.5\n0.002,0\n");
        var text = Network + """
            loads:
              hum: {kind: force, at: deck, amplitude: 1 kN, speed: 1480 rpm}
              drop: {kind: force, at: deck, time: {kind: step, value: 2 kN, at: 0.1 s}}
              bump: {kind: force, at: deck, time: {kind: half-sine, amplitude: 5 kN, duration: 20 ms}}
              start-up: {kind: unbalance, at: skid, mass-radius: 12 g*m, time: {kind: run-up, from: 0 rpm, to: 1480 rpm, over: 8 s}}
              record: {kind: force, at: skid, time: {kind: table, file: hammer.csv, unit: kN, time-unit: s}}
              quake: {kind: base-motion, support: slab, time: {kind: sine, amplitude: 0.1 g, frequency: 3 Hz}}
            transient:
              duration: 6 s
              step: 1 ms
              method: hht
              alpha: -0.1
              loads: [start-up, record]
              outputs: [skid, deck]
              initial: {skid: {displacement: 2 mm, velocity: -5 mm/s}}
              rms: {from: 4 s, to: 6 s}
              record-every: 10
            """;
        var result = Read(text);
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var model = result.Model!;
        Assert.Equal(["hum"], model.Structure.Loads.Select(l => l.Name));
        Assert.Equal(["drop", "bump", "start-up", "record", "quake"], model.TimedLoads.Select(l => l.Name));

        var drop = Assert.IsType<ForceHistory>(model.TimedLoads[0]);
        Assert.Equal(new StepFunction(2000, 0.1), drop.Time);
        var startUp = Assert.IsType<ForceHistory>(model.TimedLoads[2]);
        NumericAssert.Close(0.012, startUp.Scale, Tolerance.Rel(1e-12), "m·e");
        var ramp = Assert.IsType<UnbalanceSpeedRamp>(startUp.Time);
        NumericAssert.Close(1480 * 2 * Math.PI / 60, ramp.ToRadPerSecond, Tolerance.Rel(1e-12), "ω1");
        var record = Assert.IsType<TableFunction>(Assert.IsType<ForceHistory>(model.TimedLoads[3]).Time);
        NumericAssert.Close(1250, record.ValueAt(0.0005), Tolerance.Rel(1e-12), "table in kN, interpolated");
        var quake = Assert.IsType<SupportAccelerationHistory>(model.TimedLoads[4]);
        NumericAssert.Close(0.980665, ((SineFunction)quake.Acceleration).Amplitude, Tolerance.Rel(1e-12), "0.1 g");

        var spec = model.Transient!;
        Assert.Equal(["start-up", "record"], spec.Loads.ToArray());
        Assert.Equal(TransientMethod.Hht, spec.Settings.Method);
        NumericAssert.Close(-0.1, spec.Settings.HhtAlpha, Tolerance.Abs(1e-15), "α");
        NumericAssert.Close(1e-3, spec.Settings.Step, Tolerance.Rel(1e-12), "step");
        Assert.Equal(6000, spec.Settings.StepCount);
        Assert.Equal(new InitialCondition("skid", 0.002, -0.005), Assert.Single(spec.Initial));
        Assert.Equal(10, spec.Settings.RecordEvery);
        Assert.Equal(4.0, spec.Settings.RmsFrom);
    }

    [Theory]
    [InlineData("  step: -1 ms\n", 3, "-1 ms", "positive")]
    [InlineData("  step: 2 s\n", 3, "2 s", "longer than 'duration'")]
    [InlineData("  step: 1 ms\n  loads: [nowhere]\n", 4, "nowhere", "unknown load 'nowhere'")]
    [InlineData("  step: 1 ms\n  loads: [hum]\n", 4, "hum", "has no 'time' function")]
    [InlineData("  step: 1 ms\n  method: runge\n", 4, "runge", "'method' of 'transient'")]
    [InlineData("  step: 1 ms\n  outputs: [dek]\n", 4, "dek", "did you mean 'deck'")]
    [InlineData("  step: 1 ms\n  initial: {slab: {displacement: 1 mm}}\n", 4, "slab", "unknown mass 'slab'")]
    [InlineData("  step: 1 ms\n  initial: {skid: {displacement: 1 kg}}\n", 4, "1 kg", "displacement")]
    [InlineData("  step: 1 ms\n  rms: {from: 2 s, to: 1 s}\n", 4, "1 s", "must be after")]
    public void BadTransientSection_IsReportedAtItsPosition(string rest, int lineInSection, string token, string message)
    {
        var head = Network + """
            loads:
              hum: {kind: force, at: deck, amplitude: 1 kN}
              drop: {kind: force, at: deck, time: {kind: step, value: 2 kN}}
            transient:
              duration: 1 s

            """;
        var sectionLine = head.Split('\n').Length - 2;
        AssertSingleErrorAt(head + rest, sectionLine + lineInSection - 1, token, message);
    }

    [Theory]
    [InlineData("{kind: force, at: deck, time: {kind: hop, value: 1 kN}}", "hop", "unknown kind 'hop'")]
    [InlineData("{kind: force, at: deck, time: {kind: run-up, from: 0 rpm, to: 10 Hz, over: 1 s}}", "run-up", "belong to kind: unbalance")]
    [InlineData("{kind: unbalance, at: skid, mass-radius: 1 g*m, time: {kind: step, value: 1 kN}}", "step", "takes run-up or run-down")]
    [InlineData("{kind: unbalance, at: skid, mass-radius: 1 g*m, time: {kind: run-up, from: 10 Hz, to: 5 Hz, over: 1 s}}", "5 Hz", "run-down")]
    [InlineData("{kind: force, at: deck, time: {kind: half-sine, amplitude: 1 kN, duration: 0 s}}", "0 s", "positive")]
    [InlineData("{kind: force, at: deck, time: {kind: step, value: 3 kg}}", "3 kg", "'value'")]
    [InlineData("{kind: force, at: desk, time: {kind: step, value: 1 kN}}", "desk", "unknown mass 'desk'")]
    [InlineData("{kind: base-motion, support: ground, time: {kind: step, value: 1 g}}", "ground", "fixed")]
    [InlineData("{kind: force, at: deck, amplitude: 1 kN, time: {kind: step, value: 1 kN}}", "amplitude", "unknown key 'amplitude'")]
    [InlineData("{kind: force, at: deck, time: {kind: table, file: missing.csv}}", "missing.csv", "not found")]
    public void BadTimedLoad_IsReportedAtItsPosition(string load, string token, string message)
    {
        var text = Network + "loads:\n  hit: " + load + "\n";
        AssertSingleErrorAt(text, text.Split('\n').Length - 1, token, message);
    }

    [Theory]
    [InlineData("0,0\n0.2,1\n0.1,2\n", 3, 1, "not after the previous row's 0.2 s")]
    [InlineData("0,0\n0.1,1\n0.1,2\n", 3, 1, "not after")]
    [InlineData("0,0\n0.1,\n0.2,2\n", 2, 5, "value is missing")]
    [InlineData("0,0\n0.1 1\n", 2, 1, "exactly two fields")]
    [InlineData("time,force\n0,0\n0.1,1,5\n", 3, 1, "exactly two fields")]
    [InlineData("0,0\n0.1,abc\n", 2, 5, "'abc' is not a number")]
    [InlineData("0,0\n0.1,1e999\n", 2, 5, "not finite")]
    [InlineData("# only one row\n0,0\n", 3, 1, "at least two")]
    [InlineData("-0.1,0\n0.1,1\n", 1, 1, "negative")]
    public void BadTableRow_IsReportedInTheCsvFileAtItsLineAndColumn(string csv, int line, int column, string message)
    {
        Table("bad.csv", csv);
        var result = Read(Network + "loads:\n  hit: {kind: force, at: deck, time: {kind: table, file: bad.csv}}\n");
        Assert.False(result.Succeeded);
        var error = Assert.Single(result.Errors);
        Assert.Equal(Path.Combine(_directory, "bad.csv"), error.File);
        Assert.Equal(new SourcePosition(line, column), error.Position);
        Assert.Contains(message, error.Message);
        Assert.StartsWith($"{Path.Combine(_directory, "bad.csv")}:{line}:{column}: error: ", error.ToString());
    }

    [Fact]
    public void SeveralBadRows_AreAllReported()
    {
        Table("bad.csv", "0,0\n0.2,1\n0.1,x\n0.15,1\n0.3,\n");
        var result = Read(Network + "loads:\n  hit: {kind: force, at: deck, time: {kind: table, file: bad.csv}}\n");
        Assert.Equal([3, 4, 5], result.Errors.Select(e => e.Position.Line).ToArray());
    }

    [Fact]
    public void HarmonicSweep_CannotUseATimedLoad()
    {
        var text = Network + """
            loads:
              drop: {kind: force, at: deck, time: {kind: step, value: 2 kN}}
            harmonic:
              loads: [drop]
              frequencies: [10 Hz]
            """;
        var line = text.Split('\n').Length - 1;
        AssertSingleErrorAt(text, line, "drop", "transient runs only");
    }

    [Fact]
    public void TableNumbers_AreReadWithADecimalPoint_UnderADecimalCommaCulture()
    {
        using var culture = new CultureScope("de-DE");
        Table("hammer.csv", "0;0\n0.5;1.5\n1;0\n");
        var result = Read(Network + "loads:\n  hit: {kind: force, at: deck, time: {kind: table, file: hammer.csv}}\n");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var table = (TableFunction)((ForceHistory)result.Model!.TimedLoads[0]).Time;
        Assert.Equal([0.0, 0.5, 1.0], table.Times.ToArray());
        Assert.Equal([0.0, 1.5, 0.0], table.Values.ToArray());
    }
}
