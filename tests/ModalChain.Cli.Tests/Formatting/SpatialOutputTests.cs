using System.Collections.Immutable;
using System.Text.Json;
using ModalChain.Cli.Commands;
using ModalChain.Cli.Formatting;
using ModalChain.Cli.Tests.Schemas;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Csv;
using ModalChain.Io.Json;
using ModalChain.Io.Model;
using ModalChain.Reports.Units;
using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Formatting;

/// <summary>
/// What harmonic, transient and modes print and write for a plane model (a skid on two mounts built in code): DOF labels,
/// mount forces per element and direction with unit and amplitude kind, JSON valid against its schema; and the commands
/// that refuse plane and 3d models say so.
/// </summary>
public class SpatialOutputTests
{
    private static Network Skid()
    {
        var b = new NetworkBuilder { Space = ModelSpace.Plane, Title = "skid on two mounts" };
        b.AddBody(new RigidBody("skid", 800, new Point3(0, 0, 0), new InertiaMatrix(300, 260, 390),
            [new BodyPoint("front", new Point3(0.7, 0, -0.45)), new BodyPoint("rear", new Point3(-0.9, 0, -0.45)), new BodyPoint("rotor", new Point3(0.3, 0, 0.25))]));
        foreach (var (name, point) in new[] { ("mount-front", "skid.front"), ("mount-rear", "skid.rear") })
        {
            b.AddSpring(new Spring(name, point, Network.Ground, 6e5) { Components = [new(Direction.X, 2e5), new(Direction.Z, 6e5)] });
            b.AddDamper(new Damper(name + "-damper", point, Network.Ground, 900) { Components = [new(Direction.Z, 900), new(Direction.Ry, 40)] });
        }
        return b.Build();
    }

    private static ModelDocument Document(CriteriaSet? criteria = null, params TransientExcitation[] timed)
    {
        var network = Skid();
        var load = new UnbalanceLoad("rotor", "skid.rotor", 0.012, 24.5) { Plane = [Direction.X, Direction.Z] };
        return new ModelDocument("skid.yaml", new string('0', 64), network, [], new Dictionary<string, Io.Diagnostics.SourcePosition>())
        {
            Structure = new StructuralModel(network, new DampingModel([], null, 0.05), [load]),
            Criteria = criteria ?? CriteriaSet.None,
            TimedLoads = [.. timed],
        };
    }

    [Fact]
    public void ImperialHarmonicTable_ShowsMountForcesInPoundForce()
    {
        // 1 lbf = 4.4482216152605 N (NIST SP 811): the same mount's peak in both systems.
        var file = Path.Combine(ModalChain.Cli.Tests.Commands.CommandRun.Models(), "compressor-skid-deck.yaml");
        static (double Value, string Unit) Mount(string output)
        {
            var lines = output.Split('\n');
            var header = Array.FindIndex(lines, l => l.StartsWith("Mount forces:", StringComparison.Ordinal));
            var row = lines[header + 3].Split(' ', StringSplitOptions.RemoveEmptyEntries); // spring deck-beams z VALUE UNIT AT
            return (double.Parse(row[3], System.Globalization.CultureInfo.InvariantCulture), row[4]);
        }
        var si = Mount(ModalChain.Cli.Tests.Commands.CommandRun.Of("harmonic", file, "--units", "si").Output);
        var imperial = Mount(ModalChain.Cli.Tests.Commands.CommandRun.Of("harmonic", file, "--units", "imperial").Output);
        Assert.Equal("N", si.Unit);
        Assert.Equal("lbf", imperial.Unit);
        NumericAssert.Close(si.Value / 4.4482216152605, imperial.Value, Tolerance.Rel(1e-3), "mount force, printed to 4 digits");
    }

    [Fact]
    public void ImperialTransientTable_ShowsMountForcesInPoundForce()
    {
        // 1 lbf = 4.4482216152605 N (NIST SP 811): the same mount's peak and r.m.s. in both systems (the skid's heel-drop run).
        var file = Path.Combine(ModalChain.Cli.Tests.Commands.CommandRun.Models(), "compressor-skid-deck.yaml");
        static (double Peak, string Unit, double Rms) Mount(string output)
        {
            var lines = output.Split('\n');
            var header = Array.FindIndex(lines, l => l.StartsWith("Mount forces:", StringComparison.Ordinal));
            var row = lines[header + 3].Split(' ', StringSplitOptions.RemoveEmptyEntries); // spring deck-beams z PEAK UNIT AT RMS
            return (double.Parse(row[3], System.Globalization.CultureInfo.InvariantCulture), row[4], double.Parse(row[6], System.Globalization.CultureInfo.InvariantCulture));
        }
        var si = Mount(ModalChain.Cli.Tests.Commands.CommandRun.Of("transient", file, "--units", "si").Output);
        var imperial = Mount(ModalChain.Cli.Tests.Commands.CommandRun.Of("transient", file, "--units", "imperial").Output);
        Assert.Equal("N", si.Unit);
        Assert.Equal("lbf", imperial.Unit);
        NumericAssert.Close(si.Peak / 4.4482216152605, imperial.Peak, Tolerance.Rel(1e-3), "mount peak, printed to 4 digits");
        NumericAssert.Close(si.Rms / 4.4482216152605, imperial.Rms, Tolerance.Rel(1e-3), "mount r.m.s., printed to 4 digits");
    }

    [Fact]
    public void ImperialModesTable_OfA3dModel_ShowsDirectionTotalsAndTheReferencePointInImperialUnits()
    {
        // The skid example of models/: totals per direction in lb and lb*in^2 (1 kg*m^2 =
        // 2.20462262 lb * 1550.0031 in^2, NIST SP 811 factors), the reference point in inches, never kg or m.
        var file = Path.Combine(ModalChain.Cli.Tests.Commands.CommandRun.Models(), "compressor-skid-deck.yaml");
        var si = ModalChain.Cli.Tests.Commands.CommandRun.Of("modes", file, "--units", "si");
        var imperial = ModalChain.Cli.Tests.Commands.CommandRun.Of("modes", file, "--units", "imperial");
        Assert.Equal(0, si.ExitCode);
        Assert.Equal(0, imperial.ExitCode);
        Assert.DoesNotContain(" kg", imperial.Output);
        Assert.DoesNotContain(") m", imperial.Output);
        static double Total(string output, string direction)
        {
            var at = output.IndexOf($"total {direction}: ", StringComparison.Ordinal);
            var text = output[(at + direction.Length + 8)..].Split(' ')[0];
            return double.Parse(text, System.Globalization.CultureInfo.InvariantCulture);
        }
        NumericAssert.Close(Total(si.Output, "rx") * 2.20462262185 / (0.0254 * 0.0254), Total(imperial.Output, "rx"), Tolerance.Rel(2e-4), "rx total, printed to 5 digits");
        NumericAssert.Close(Total(si.Output, "z") * 2.20462262185, Total(imperial.Output, "z"), Tolerance.Rel(2e-4), "z total, printed to 5 digits");
    }

    [Fact]
    public void HarmonicJsonAndTable_ReportMountForcesPerDirection()
    {
        var document = Document();
        var system = DampedSystem.Build(document.Structure);
        var result = HarmonicAnalysis.Solve(system, HarmonicSpec.Default(1, 40, 80));
        using var stream = new MemoryStream();
        HarmonicJson.Write(stream, document, result, "test");
        var json = System.Text.Encoding.UTF8.GetString(stream.ToArray());
        SchemaFiles.AssertValid("harmonic.schema.json", json, "harmonic of a plane model");
        using var parsed = JsonDocument.Parse(json);
        var mounts = parsed.RootElement.GetProperty("mount_forces").EnumerateArray().ToArray();
        Assert.Contains(mounts, m => m.GetProperty("element").GetString() == "mount-front" && m.GetProperty("direction").GetString() == "z"
            && m.GetProperty("unit").GetString() == "N" && m.GetProperty("amplitude").GetString() == "peak");
        Assert.Contains(mounts, m => m.GetProperty("direction").GetString() == "ry" && m.GetProperty("unit").GetString() == "N*m");
        var op = parsed.RootElement.GetProperty("operating_points")[0];
        Assert.Equal(mounts.Length, op.GetProperty("mount_forces").GetArrayLength());
        Assert.Equal(["skid.x", "skid.z", "skid.ry"], parsed.RootElement.GetProperty("responses").EnumerateArray()
            .Select(r => r.GetProperty("dof").GetString()!).Distinct());

        var text = new StringWriter();
        HarmonicTable.Write(text, document, system, result, new DisplayUnits(UnitSystem.Si));
        var lines = text.ToString().Split('\n');
        Assert.Contains(lines, l => l.StartsWith("Mount forces: largest amplitude over the sweep", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.StartsWith("Mount forces at 24.5 Hz", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.Contains("damper mount-rear-damper", StringComparison.Ordinal) && l.Contains(" ry ", StringComparison.Ordinal) && l.Contains("N*m", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.Contains("unbalance 0.012 kg*m at skid.rotor turning in xz", StringComparison.Ordinal));

        var csv = new StringWriter();
        HarmonicCsv.Write(csv, result);
        Assert.Contains("mount-front spring z magnitude [N]", csv.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void TransientJsonAndTable_ReportMountForcePeaks()
    {
        var step = new ForceHistory("knock", "skid.rotor", 1, new StepFunction(200, 0)) { Direction = Direction.X };
        var document = Document(null, step);
        var system = DampedSystem.Build(document.Structure);
        var result = TransientAnalysis.Run(system, [step], [], new TransientSettings(0.5, 1e-3));
        using var stream = new MemoryStream();
        TransientJson.Write(stream, document, result, ["knock"], "test");
        var json = System.Text.Encoding.UTF8.GetString(stream.ToArray());
        SchemaFiles.AssertValid("transient.schema.json", json, "transient of a plane model");
        using var parsed = JsonDocument.Parse(json);
        var mounts = parsed.RootElement.GetProperty("mount_forces").EnumerateArray().ToArray();
        var front = mounts.Single(m => m.GetProperty("element").GetString() == "mount-front" && m.GetProperty("direction").GetString() == "x");
        Assert.True(front.GetProperty("peak_abs").GetDouble() > 0);
        Assert.Equal(Math.Abs(front.GetProperty("peak_value").GetDouble()), front.GetProperty("peak_abs").GetDouble());
        Assert.Equal(0, parsed.RootElement.GetProperty("element_forces").GetArrayLength());

        var text = new StringWriter();
        TransientTable.Write(text, document, system, result, [step], new DisplayUnits(UnitSystem.Si));
        Assert.Contains("Mount forces: peak (largest magnitude, with sign)", text.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void ModesOutputs_LabelTheDirectionsOfEachNode()
    {
        var document = Document();
        var result = ModalAnalysis.Solve(document.Network);
        using var stream = new MemoryStream();
        ModesJson.Write(stream, document, result, "test");
        var json = System.Text.Encoding.UTF8.GetString(stream.ToArray());
        SchemaFiles.AssertValid("modes.schema.json", json, "modes of a plane model");
        using var parsed = JsonDocument.Parse(json);
        Assert.Equal(["skid.x", "skid.z", "skid.ry"], parsed.RootElement.GetProperty("dofs").EnumerateArray().Select(d => d.GetString()!));
        Assert.Equal(["skid.x", "skid.z", "skid.ry"], parsed.RootElement.GetProperty("modes")[0].GetProperty("shape").EnumerateObject().Select(p => p.Name));
        var csv = new StringWriter();
        ModesCsv.Write(csv, result);
        Assert.Contains("shape skid.ry [kg^-0.5]", csv.ToString(), StringComparison.Ordinal);
        var mode = parsed.RootElement.GetProperty("modes")[0];
        Assert.Equal(["x", "z", "ry"], mode.GetProperty("kinetic_energy_by_direction").EnumerateObject().Select(p => p.Name));
        Assert.Equal(["kg", "kg", "kg*m^2"], mode.GetProperty("effective_mass_by_direction").EnumerateArray().Select(e => e.GetProperty("unit").GetString()!));
        Assert.False(string.IsNullOrEmpty(mode.GetProperty("motion").GetString()));
        var table = new StringWriter();
        ModesTable.Write(table, result, new DisplayUnits(UnitSystem.Si));
        var text = table.ToString();
        Assert.Contains("skid.", text, StringComparison.Ordinal);
        Assert.Contains("Motion of each mode", text, StringComparison.Ordinal);
        Assert.Contains("Effective mass per direction", text, StringComparison.Ordinal);
        foreach (var m in result.Modes) Assert.Contains(m.Motion!, text, StringComparison.Ordinal);
    }

    [Fact]
    public void OutputNames_OnSpatialModels_AreDofLabelsMassesOrBodies()
    {
        var document = Document();
        Assert.Equal(["nowhere"], SpatialSupport.UnknownOutputs(document.Network, ["skid", "skid.ry", "nowhere"]));
    }
}
