using System.Text;
using System.Text.Json;
using ModalChain.Core;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Io.Json;
using ModalChain.Io.Model;
using ModalChain.TestSupport;
using static ModalChain.Io.Tests.Model.ModelText;

namespace ModalChain.Io.Tests.Json;

/// <summary>The JSON of <c>modes --format json</c>: stable field names (issue 2, item 7), SI values, culture-proof.</summary>
public class ModesJsonTests
{
    internal static (ModelDocument Document, ModalResult Result) Solve(params string[] lines)
    {
        var r = Read(lines);
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        return (r.Model!, ModalAnalysis.Solve(r.Model!.Network));
    }

    // Two masses in a chain from ground, k3 = 0: case A of /work/shared/REFERENCES.md §1,
    // Rao, Mechanical Vibrations, 5th ed., Ex. 5.3 (values recomputed; attribution from memory).
    internal static readonly string[] CaseA =
    [
        "title: Two-mass chain (case A)",
        "masses:",
        "  m1: 10 kg",
        "  m2: 1 kg",
        "springs:",
        "  k1: {between: [ground, m1], stiffness: 30 N/m}",
        "  k2: {between: [m1, m2], stiffness: 5 N/m}",
    ];

    internal static string Write(ModelDocument document, ModalResult result)
    {
        using var stream = new MemoryStream();
        ModesJson.Write(stream, document, result, "9.9.9-test");
        return Encoding.UTF8.GetString(stream.ToArray());
    }

    private static JsonElement Parse(string json) => JsonDocument.Parse(json).RootElement;

    private static string[] Names(JsonElement obj) => [.. obj.EnumerateObject().Select(p => p.Name)];

    [Fact]
    public void FieldNames_AreTheStableContract()
    {
        var (doc, result) = Solve(CaseA);
        var root = Parse(Write(doc, result));
        Assert.Equal(JsonValueKind.Object, root.ValueKind);

        // Issue 2 item 7 names these and asks that they stay; the rest are additions documented with the format.
        string[] required = ["title", "dofs", "total_mass_kg", "modes", "quality"];
        string[] requiredMode = ["number", "frequency_hz", "omega_rad_s", "period_s", "shape", "participation", "effective_mass_kg", "effective_mass_fraction"];
        Assert.Subset(Names(root).ToHashSet(), required.ToHashSet());
        Assert.Equal(["title", "format_version", "source", "dofs", "total_mass_kg", "algorithm", "energy_share_modes", "modes", "damping", "quality", "warnings", "caution"], Names(root));
        Assert.Equal(2, root.GetProperty("energy_share_modes").GetInt32());

        foreach (var mode in root.GetProperty("modes").EnumerateArray())
        {
            Assert.Subset(Names(mode).ToHashSet(), requiredMode.ToHashSet());
            Assert.Equal(
                ["number", "frequency_hz", "omega_rad_s", "period_s", "rigid_body", "shape", "participation", "effective_mass_kg",
                 "effective_mass_fraction", "cumulative_mass_fraction", "kinetic_energy_share", "strain_energy_share", "residual",
                 "damping_ratio", "damped_frequency_hz"],
                Names(mode));
            Assert.Equal(["m1", "m2"], Names(mode.GetProperty("shape")));
            Assert.Equal(["k1", "k2"], Names(mode.GetProperty("strain_energy_share")));
        }
        Assert.Equal(["max_residual", "max_orthogonality_error", "solver"], Names(root.GetProperty("quality")));
        Assert.Equal(["file", "sha256", "tool_version"], Names(root.GetProperty("source")));
    }

    [Fact]
    public void Values_MatchThePublishedTwoMassExample()
    {
        // Case A: ω = 1.581139, 2.449490 rad/s; X2/X1 = 2, −5; effective masses 10.285714 and 0.714286 kg
        // (REFERENCES.md §1; values recomputed; attribution from memory). Printed to 6 significant figures, so 1e-6 relative.
        var (doc, result) = Solve(CaseA);
        var root = Parse(Write(doc, result));
        Assert.Equal("Two-mass chain (case A)", root.GetProperty("title").GetString());
        Assert.Equal(["m1", "m2"], root.GetProperty("dofs").EnumerateArray().Select(e => e.GetString()));
        NumericAssert.Close(11, root.GetProperty("total_mass_kg").GetDouble(), Tolerance.Rel(1e-15), "total mass");

        var modes = root.GetProperty("modes").EnumerateArray().ToArray();
        Assert.Equal(2, modes.Length);
        double[] omega = [1.581139, 2.449490], ratio = [2, -5], effective = [10.285714, 0.714286];
        for (var i = 0; i < 2; i++)
        {
            var m = modes[i];
            Assert.Equal(i + 1, m.GetProperty("number").GetInt32());
            var w = m.GetProperty("omega_rad_s").GetDouble();
            NumericAssert.Close(omega[i], w, Tolerance.Rel(1e-6), $"ω{i + 1}");
            NumericAssert.Close(w / (2 * Math.PI), m.GetProperty("frequency_hz").GetDouble(), Tolerance.Rel(1e-14), $"f{i + 1} = ω/2π");
            NumericAssert.Close(2 * Math.PI / w, m.GetProperty("period_s").GetDouble(), Tolerance.Rel(1e-14), $"T{i + 1} = 2π/ω");
            var shape = m.GetProperty("shape");
            NumericAssert.Close(ratio[i], shape.GetProperty("m2").GetDouble() / shape.GetProperty("m1").GetDouble(), Tolerance.Rel(1e-9), $"X2/X1 mode {i + 1}");
            NumericAssert.Close(effective[i], m.GetProperty("effective_mass_kg").GetDouble(), Tolerance.Rel(1e-6), $"M*{i + 1}");
            // Mass-normalised shapes: M* = Γ² (common practice, REFERENCES.md §7).
            var gamma = m.GetProperty("participation").GetDouble();
            NumericAssert.Close(gamma * gamma, m.GetProperty("effective_mass_kg").GetDouble(), Tolerance.Rel(1e-12), $"Γ² = M* mode {i + 1}");
            NumericAssert.Close(m.GetProperty("effective_mass_kg").GetDouble() / 11, m.GetProperty("effective_mass_fraction").GetDouble(), Tolerance.Rel(1e-12), "fraction");
            Assert.False(m.GetProperty("rigid_body").GetBoolean());
        }
        NumericAssert.Close(1, modes[1].GetProperty("cumulative_mass_fraction").GetDouble(), Tolerance.Abs(1e-12), "cumulative fraction");
        NumericAssert.Small(root.GetProperty("quality").GetProperty("max_residual").GetDouble(), 1e-12, "max residual");
        NumericAssert.Small(root.GetProperty("quality").GetProperty("max_orthogonality_error").GetDouble(), 1e-12, "max orthogonality error");
    }

    [Fact]
    public void Numbers_RoundTripExactly()
    {
        var (doc, result) = Solve(CaseA);
        var modes = Parse(Write(doc, result)).GetProperty("modes").EnumerateArray().ToArray();
        for (var i = 0; i < result.Modes.Length; i++)
        {
            Assert.Equal(result.Modes[i].NaturalFrequencyHz, modes[i].GetProperty("frequency_hz").GetDouble());
            Assert.Equal(result.Modes[i].Shape[0], modes[i].GetProperty("shape").GetProperty("m1").GetDouble());
        }
    }

    [Fact]
    public void RigidBodyMode_HasNullPeriodAndZeroFrequency()
    {
        // Two masses joined by one spring and held by nothing: one rigid-body mode and ω² = k (m1 + m2)/(m1 m2)
        // (free-free two-mass oscillator; common practice).
        var (doc, result) = Solve("masses:", "  cart: 400 kg", "  load: 100 kg", "springs:", "  coupler: {between: [cart, load], stiffness: 20 kN/m}");
        var root = Parse(Write(doc, result));
        var modes = root.GetProperty("modes").EnumerateArray().ToArray();
        Assert.True(modes[0].GetProperty("rigid_body").GetBoolean());
        Assert.Equal(JsonValueKind.Null, modes[0].GetProperty("period_s").ValueKind);
        Assert.Equal(0.0, modes[0].GetProperty("frequency_hz").GetDouble());
        NumericAssert.Close(Math.Sqrt(20e3 * 500 / (400.0 * 100)), modes[1].GetProperty("omega_rad_s").GetDouble(), Tolerance.Rel(1e-12), "elastic ω");
        Assert.Equal(JsonValueKind.Number, modes[1].GetProperty("period_s").ValueKind);
        // The rigid-body mode carries all the mass for a translation (M* = total mass), the elastic one none.
        NumericAssert.Close(1, modes[0].GetProperty("effective_mass_fraction").GetDouble(), Tolerance.Abs(1e-12), "rigid-body fraction");
        var warning = Assert.Single(root.GetProperty("warnings").EnumerateArray());
        Assert.Contains("not connected to ground", warning.GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Output_IsIdenticalUnderADecimalCommaCulture()
    {
        var (doc, result) = Solve(CaseA);
        var invariant = Write(doc, result);
        string german;
        using (new CultureScope("de-DE")) german = Write(doc, result);
        Assert.Equal(invariant, german);
        Assert.Matches(@"""omega_rad_s"": 1\.58113\d+", invariant);
    }

    [Fact]
    public void Source_AndCaution_AreRecorded()
    {
        var (doc, result) = Solve(CaseA);
        var root = Parse(Write(doc, result));
        var source = root.GetProperty("source");
        Assert.Equal(FileName, source.GetProperty("file").GetString());
        Assert.Equal(doc.Sha256, source.GetProperty("sha256").GetString());
        Assert.Equal("9.9.9-test", source.GetProperty("tool_version").GetString());
        Assert.Equal(Cautions.Text, root.GetProperty("caution").GetString());
    }

    [Fact]
    public void NonAsciiNames_AreWrittenReadably()
    {
        var (doc, result) = Solve("title: Bühne über dem Keller", "masses:", "  bühne: 3 t", "springs:", "  stütze: {between: [ground, bühne], stiffness: 50 kN/mm}");
        var json = Write(doc, result);
        Assert.Contains("\"bühne\"", json, StringComparison.Ordinal);
        Assert.Equal("Bühne über dem Keller", Parse(json).GetProperty("title").GetString());
    }

    /// <summary>A chain of <paramref name="count"/> equal masses from ground, one spring between neighbours.</summary>
    private static string[] Chain(int count) =>
    [
        $"title: Chain of {count} masses",
        "masses:",
        .. Enumerable.Range(1, count).Select(i => $"  m{i}: 10 kg"),
        "springs:",
        .. Enumerable.Range(1, count).Select(i => $"  k{i}: {{between: [{(i == 1 ? "ground" : $"m{i - 1}")}, m{i}], stiffness: 1 kN/m}}"),
    ];

    [Fact]
    public void EnergyShares_ByDefault_OnlyForTheLowestModes()
    {
        var (doc, result) = Solve(Chain(ModesJson.DefaultEnergyShareModes + 5));
        var root = Parse(Write(doc, result));
        Assert.Equal(ModesJson.DefaultEnergyShareModes, root.GetProperty("energy_share_modes").GetInt32());
        var modes = root.GetProperty("modes").EnumerateArray().ToArray();
        Assert.Equal(ModesJson.DefaultEnergyShareModes + 5, modes.Length);
        for (var i = 0; i < modes.Length; i++)
        {
            var carries = i < ModesJson.DefaultEnergyShareModes;
            Assert.Equal(carries, modes[i].TryGetProperty("kinetic_energy_share", out _));
            Assert.Equal(carries, modes[i].TryGetProperty("strain_energy_share", out _));
            Assert.True(modes[i].TryGetProperty("shape", out _), $"mode {i + 1} keeps its shape");
        }
    }

    [Fact]
    public void EnergyShares_ForEveryModeWhenAsked_MatchTheModalResult()
    {
        var (doc, result) = Solve(Chain(ModesJson.DefaultEnergyShareModes + 5));
        using var stream = new MemoryStream();
        ModesJson.Write(stream, doc, result, "9.9.9-test", energyShareModes: int.MaxValue);
        var root = Parse(Encoding.UTF8.GetString(stream.ToArray()));
        Assert.Equal(result.Modes.Length, root.GetProperty("energy_share_modes").GetInt32());
        var modes = root.GetProperty("modes").EnumerateArray().ToArray();
        for (var i = 0; i < modes.Length; i++)
        {
            var kinetic = modes[i].GetProperty("kinetic_energy_share").EnumerateObject().Select(p => p.Value.GetDouble()).ToArray();
            var strain = modes[i].GetProperty("strain_energy_share").EnumerateObject().Select(p => p.Value.GetDouble()).ToArray();
            NumericAssert.Close(result.Modes[i].KineticEnergyShare.ToArray(), kinetic, Tolerance.Abs(0), $"mode {i + 1} kinetic shares round-trip");
            NumericAssert.Close(result.Modes[i].StrainEnergyShare.ToArray(), strain, Tolerance.Abs(0), $"mode {i + 1} strain shares round-trip");
            // Each set of shares sums to 1 (identity: the shares divide the mode's energy).
            NumericAssert.Close(1, kinetic.Sum(), Tolerance.Abs(1e-12), $"mode {i + 1} Σ kinetic");
            NumericAssert.Close(1, strain.Sum(), Tolerance.Abs(1e-12), $"mode {i + 1} Σ strain");
        }
    }

    [Fact]
    public void EnergyShares_None_LeavesEveryModeWithoutThem()
    {
        var (doc, result) = Solve(CaseA);
        using var stream = new MemoryStream();
        ModesJson.Write(stream, doc, result, "9.9.9-test", energyShareModes: 0);
        var root = Parse(Encoding.UTF8.GetString(stream.ToArray()));
        Assert.Equal(0, root.GetProperty("energy_share_modes").GetInt32());
        Assert.All(root.GetProperty("modes").EnumerateArray(), m => Assert.False(m.TryGetProperty("strain_energy_share", out _)));
    }

    // Peak memory: the modes go to the stream while they are being written, not after the document is complete (the
    // serializer flushes its buffer between items of a sequence; common practice for System.Text.Json streams).
    [Fact]
    public void Modes_ReachTheStream_WhileTheyAreStillBeingWritten()
    {
        var (doc, result) = Solve(Chain(200));
        using var stream = new MemoryStream();
        long writtenBeforeLastMode = -1;
        var output = ModesJson.Output(doc, result, "9.9.9-test", energyShareModes: int.MaxValue);
        IEnumerable<ModalChain.Io.Json.Records.ModeOutput> Tracked()
        {
            var modes = output.Modes.ToArray();
            for (var k = 0; k < modes.Length - 1; k++) yield return modes[k];
            writtenBeforeLastMode = stream.Length;
            yield return modes[^1];
        }
        OutputJson.Write(stream, output with { Modes = Tracked() });
        Assert.Equal(200, Parse(Encoding.UTF8.GetString(stream.ToArray())).GetProperty("modes").GetArrayLength());
        Assert.True(writtenBeforeLastMode > 0.95 * stream.Length,
            $"{writtenBeforeLastMode} of {stream.Length} bytes had reached the stream before the last mode was read");
    }
}
