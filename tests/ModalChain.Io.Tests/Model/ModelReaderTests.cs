using System.Security.Cryptography;
using System.Text;
using ModalChain.Core.Model;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Model;
using ModalChain.TestSupport;
using static ModalChain.Io.Tests.Model.ModelText;

namespace ModalChain.Io.Tests.Model;

/// <summary>Valid model files read to the right SI network, with warnings (not errors) for unsupported parts.</summary>
public class ModelReaderTests
{
    // Conversion factors exact by definition (common practice): inch = 0.0254 m, pound = 0.45359237 kg
    // (international yard and pound, 1959), pound-force = pound × standard gravity 9.80665 m/s².
    private const double Inch = 0.0254, Pound = 0.45359237, PoundForce = Pound * 9.80665;

    private static readonly string[] UnitModel =
    [
        "title: Every unit of the model format",
        "masses:",
        "  m-kg: 12.5 kg",
        "  m-g: {mass: 2500 g, at: [1500 mm, 2 in]}",
        "  m-t: {mass: 1.2 t, at: [0.5 m, -3]}",
        "  m-cm: {mass: 3 kg, at: [25 cm, 1500 µm]}",
        "  m-lb: 100 lb",
        "  m-plain: 7",
        "springs:",
        "  k-nm: {between: [ground, m-kg], stiffness: 1500 N/m}",
        "  k-knm: {between: [m-kg, m-g], stiffness: 2.5 kN/m}",
        "  k-nmm: {between: [m-g, m-t], stiffness: 40 N/mm}",
        "  k-knmm: {between: [m-t, m-lb], stiffness: 0.8 kN/mm}",
        "  k-mnm: {between: [m-lb, m-plain], stiffness: 1.1 MN/m}",
        "  k-lbfin: {between: [ground, m-plain], stiffness: 500 lbf/in}",
        "  k-plain: {between: [ground, m-t], stiffness: 3e5}",
        "  k-cm: {between: [ground, m-cm], stiffness: 1 kN/mm}",
        "dampers:",
        "  c-star: {between: [ground, m-kg], coefficient: 10 N*s/m}",
        "  c-dot: {between: [ground, m-g], coefficient: 11 N·s/m}",
        "  c-ns: {between: [ground, m-t], coefficient: 12 Ns/m}",
        "  c-kn: {between: [ground, m-lb], coefficient: 1.3 kN*s/m}",
        "  c-plain: {between: [ground, m-plain], coefficient: 14}",
        "  c-space: {between: [ground, m-kg], coefficient: 15 N s/m}",
        "  c-kns: {between: [ground, m-g], coefficient: 1.6 kNs/m}",
        "  c-nsmm: {between: [ground, m-t], coefficient: 1.7 N*s/mm}",
        "  c-lbf: {between: [ground, m-lb], coefficient: 2 lbf*s/in}",
        "  c-middot: {between: [ground, m-plain], coefficient: 1.9 kN⋅s/m}",
    ];

    private static Network ReadUnitModel()
    {
        var r = Read(UnitModel);
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        Assert.Empty(r.Diagnostics);
        return r.Model!.Network;
    }

    [Fact]
    public void EveryUnitOfTheFormat_ReadsToSi()
    {
        var n = ReadUnitModel();
        var exact = Tolerance.Rel(1e-15);
        double Mass(string name) => n.Masses.Single(m => m.Name == name).Kilograms;
        double K(string name) => n.Springs.Single(s => s.Name == name).Stiffness;
        double C(string name) => n.Dampers.Single(d => d.Name == name).Coefficient;

        NumericAssert.Close(12.5, Mass("m-kg"), exact, "kg");
        NumericAssert.Close(2.5, Mass("m-g"), exact, "g");
        NumericAssert.Close(1200, Mass("m-t"), exact, "t");
        NumericAssert.Close(100 * Pound, Mass("m-lb"), exact, "lb");
        NumericAssert.Close(7, Mass("m-plain"), exact, "plain number = kg");

        NumericAssert.Close(1500, K("k-nm"), exact, "N/m");
        NumericAssert.Close(2500, K("k-knm"), exact, "kN/m");
        NumericAssert.Close(40e3, K("k-nmm"), exact, "N/mm");
        NumericAssert.Close(0.8e6, K("k-knmm"), exact, "kN/mm");
        NumericAssert.Close(1.1e6, K("k-mnm"), exact, "MN/m");
        NumericAssert.Close(500 * PoundForce / Inch, K("k-lbfin"), exact, "lbf/in");
        NumericAssert.Close(3e5, K("k-plain"), exact, "plain number = N/m");

        NumericAssert.Close(10, C("c-star"), exact, "N*s/m");
        NumericAssert.Close(11, C("c-dot"), exact, "N·s/m");
        NumericAssert.Close(12, C("c-ns"), exact, "Ns/m");
        NumericAssert.Close(1300, C("c-kn"), exact, "kN*s/m");
        NumericAssert.Close(14, C("c-plain"), exact, "plain number = N*s/m");
        NumericAssert.Close(15, C("c-space"), exact, "N s/m");
        NumericAssert.Close(1600, C("c-kns"), exact, "kNs/m");
        NumericAssert.Close(1700, C("c-nsmm"), exact, "N*s/mm");
        NumericAssert.Close(2 * PoundForce / Inch, C("c-lbf"), exact, "lbf*s/in");
        NumericAssert.Close(1900, C("c-middot"), exact, "kN⋅s/m (dot operator)");
    }

    [Fact]
    public void DrawingPositions_ReadInMetres()
    {
        var n = ReadUnitModel();
        var g = n.Masses.Single(m => m.Name == "m-g").Position!.Value;
        NumericAssert.Close(1.5, g.X, Tolerance.Rel(1e-15), "1500 mm");
        NumericAssert.Close(2 * Inch, g.Y, Tolerance.Rel(1e-15), "2 in");
        var t = n.Masses.Single(m => m.Name == "m-t").Position!.Value;
        Assert.Equal(new DrawingPosition(0.5, -3), t);
        Assert.Null(n.Masses.Single(m => m.Name == "m-kg").Position);
        var cm = n.Masses.Single(m => m.Name == "m-cm").Position!.Value;
        NumericAssert.Close(0.25, cm.X, Tolerance.Rel(1e-15), "25 cm");
        NumericAssert.Close(1.5e-3, cm.Y, Tolerance.Rel(1e-15), "1500 µm");
    }

    [Fact]
    public void ShorthandMass_ReadsLikeTheLongForm()
    {
        var shorthand = Read("masses:", "  deck: 3200 kg", "springs:", "  c: {between: [ground, deck], stiffness: 95 kN/mm}");
        var longForm = Read("masses:", "  deck: {mass: 3200 kg}", "springs:", "  c: {between: [ground, deck], stiffness: 95 kN/mm}");
        Assert.True(shorthand.Succeeded && longForm.Succeeded);
        Assert.Equal(longForm.Model!.Network.Masses.ToArray(), shorthand.Model!.Network.Masses.ToArray());
        Assert.Equal(3200.0, shorthand.Model.Network.Masses[0].Kilograms);
    }

    [Fact]
    public void QuotedValues_ReadLikePlainOnes()
    {
        var r = Read("masses:", "  deck: '3200 kg'", "springs:", "  c: {between: [ground, deck], stiffness: \"95 kN/mm\"}");
        Assert.True(r.Succeeded);
        Assert.Equal(95e6, r.Model!.Network.Springs[0].Stiffness);
    }

    [Fact]
    public void ReadUnderADecimalCommaCulture_GivesIdenticalSiValues()
    {
        var invariant = ReadUnitModel();
        Network german;
        using (new CultureScope("de-DE")) german = ReadUnitModel();
        // Exact equality: the same text must give the same doubles whatever the current culture.
        Assert.Equal(invariant.Masses.ToArray(), german.Masses.ToArray());
        Assert.Equal(invariant.Springs.ToArray(), german.Springs.ToArray());
        Assert.Equal(invariant.Dampers.ToArray(), german.Dampers.ToArray());
    }

    [Fact]
    public void ElementsKeepFileOrderAndTitle()
    {
        var n = ReadUnitModel();
        Assert.Equal("Every unit of the model format", n.Title);
        Assert.Equal(["m-kg", "m-g", "m-t", "m-cm", "m-lb", "m-plain"], n.Masses.Select(m => m.Name));
        Assert.Equal(("ground", "m-kg"), (n.Springs[0].NodeA, n.Springs[0].NodeB));
        Assert.Equal(8, n.Springs.Length);
        Assert.Equal(10, n.Dampers.Length);
    }

    [Fact]
    public void MissingTitle_DefaultsToTheFileName()
    {
        var r = ModelReader.Read(Lines("masses:", "  deck: 3200 kg", "springs:", "  c: {between: [ground, deck], stiffness: 1 kN/mm}"), "models/plant-room.yaml");
        Assert.Equal("plant-room", r.Model!.Network.Title);
    }

    [Fact]
    public void EmptySpringsAndDampersSections_AreAllowed()
    {
        var r = Read("masses:", "  deck: 3200 kg", "springs:", "dampers: {}");
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        Assert.Empty(r.Model!.Network.Springs);
    }

    [Fact]
    public void PositionsOfElements_AreRecorded()
    {
        var r = Read(UnitModel);
        var p = r.Model!.Positions;
        Assert.Equal(new SourcePosition(3, 3), p["masses.m-kg"]);
        Assert.Equal(new SourcePosition(10, 3), p["springs.k-nm"]);
        Assert.Equal(new SourcePosition(23, 3), p["dampers.c-plain"]);
    }

    [Fact]
    public void Sha256_IsTheHashOfTheFileBytes_IncludingBomAndLineEndings()
    {
        var path = Path.Combine(Path.GetTempPath(), $"modalchain-bom-{Guid.NewGuid():N}.yaml");
        // A byte-order mark and Windows line endings, as a Windows editor may save the file.
        var bytes = Encoding.UTF8.GetPreamble()
            .Concat(Encoding.UTF8.GetBytes("title: Deck\r\nmasses:\r\n  deck: 3200 kg\r\nsprings:\r\n  c: {between: [ground, deck], stiffness: 95 kN/mm}\r\n"))
            .ToArray();
        File.WriteAllBytes(path, bytes);
        try
        {
            var r = ModelReader.ReadFile(path);
            Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
            Assert.Equal("Deck", r.Model!.Network.Title);
            Assert.Equal(3200.0, r.Model.Network.Masses[0].Kilograms);
            Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(bytes)), r.Model.Sha256);
            Assert.Equal(64, r.Model.Sha256.Length);
            Assert.Equal(path, r.Model.File);
        }
        finally { File.Delete(path); }
    }

    [Fact]
    public void Sha256_MatchesAKnownDigest()
    {
        // Known-answer check of the whole path: SHA-256 of the 78 ASCII bytes below, computed independently with
        // `printf 'masses:\n  deck: 3200 kg\nsprings:\n  c: {between: [ground, deck], stiffness: 1}\n' | sha256sum`.
        var r = ModelReader.Read("masses:\n  deck: 3200 kg\nsprings:\n  c: {between: [ground, deck], stiffness: 1}\n", FileName);
        Assert.Equal(KnownDigest, r.Model!.Sha256);
    }

    private const string KnownDigest = "67e49ccc45bb4ca31c994277313c184fa8122a8305e840ad1581fa0a92e4e2d8";

    [Fact]
    public void ErrorPositionsInABomPrefixedFile_CountFromTheFirstCharacterAfterTheMark()
    {
        var r = ModelReader.Read("\uFEFFmasses:\n  deck: -1 kg\n", FileName);
        SingleError(r, 2, 9, "must be positive");
    }

    [Fact]
    public void ErrorPositionsWithWindowsLineEndings_AreTheSame()
    {
        var r = ModelReader.Read("masses:\r\n  deck: 3200 kg\r\n  skid: -1 kg\r\n", FileName);
        SingleError(r, 3, 9, "must be positive");
    }

    [Fact]
    public void GroupNotConnectedToGround_IsAWarningNotAnError()
    {
        var r = Read(
            "masses:",
            "  deck: 3200 kg",
            "  cart: 400 kg",
            "  load: 300 kg",
            "springs:",
            "  columns: {between: [ground, deck], stiffness: 95 kN/mm}",
            "  coupler: {between: [cart, load], stiffness: 2 kN/mm}");
        Assert.True(r.Succeeded);
        Assert.Empty(r.Errors);
        var w = Assert.Single(r.Diagnostics);
        Assert.Equal(Severity.Warning, w.Severity);
        Assert.Equal(new SourcePosition(3, 3), w.Position);
        Assert.Contains("'cart', 'load'", w.Message, StringComparison.Ordinal);
        Assert.Contains("not connected to ground", w.Message, StringComparison.Ordinal);
        Assert.Contains("rigid-body mode", w.Message, StringComparison.Ordinal);
        Assert.StartsWith($"{FileName}:3:3: warning: ", w.ToString(), StringComparison.Ordinal);
        Assert.Equal(r.Diagnostics.ToArray(), r.Model!.Warnings.ToArray());
    }

    [Fact]
    public void MassWithNoSpring_IsAWarning_EvenWhenADamperHoldsIt()
    {
        // A damper alone gives no static stiffness: the mass still has a rigid-body mode.
        var r = Read(
            "masses:",
            "  deck: 3200 kg",
            "  pendant: 40 kg",
            "springs:",
            "  columns: {between: [ground, deck], stiffness: 95 kN/mm}",
            "dampers:",
            "  dashpot: {between: [deck, pendant], coefficient: 100 N*s/m}");
        Assert.True(r.Succeeded);
        var w = Assert.Single(r.Diagnostics);
        Assert.Equal(Severity.Warning, w.Severity);
        Assert.Equal(new SourcePosition(3, 3), w.Position);
        Assert.Contains("mass 'pendant' has no spring", w.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void ALooseMass_DoesNotHideAnErrorElsewhere()
    {
        // Connectivity warnings are only worked out for a model without errors; the error must still be reported.
        var r = Read("masses:", "  deck: 3200 kg", "  loose: 10 kg", "springs:", "  c: {between: [ground, deck], stiffness: -1}");
        Assert.False(r.Succeeded);
        ErrorAt(r, 5, ColumnOf("  c: {between: [ground, deck], stiffness: -1}", "-1"), "cannot be negative");
    }

    [Fact]
    public void Latin1File_IsReportedAtTheFirstByteThatIsNotUtf8()
    {
        // "Bühne" saved in ISO-8859-1: ü is the single byte 0xFC, which UTF-8 does not allow on its own.
        var bytes = Encoding.Latin1.GetBytes("masses:\n  deck: 3200 kg\n  Bühne: 10 kg\n");
        var path = Path.Combine(Path.GetTempPath(), $"modalchain-latin1-{Guid.NewGuid():N}.yaml");
        File.WriteAllBytes(path, bytes);
        try
        {
            var r = ModelReader.ReadFile(path);
            var d = Assert.Single(r.Errors);
            Assert.Equal(new SourcePosition(3, 4), d.Position);
            Assert.Contains("not UTF-8", d.Message, StringComparison.Ordinal);
            Assert.Contains("0xFC", d.Message, StringComparison.Ordinal);
        }
        finally { File.Delete(path); }
    }

    [Fact]
    public void Utf16FileWithAByteOrderMark_Reads()
    {
        var text = "title: Bühne\nmasses:\n  deck: 3200 kg\nsprings:\n  c: {between: [ground, deck], stiffness: 95 kN/mm}\n";
        var bytes = Encoding.Unicode.GetPreamble().Concat(Encoding.Unicode.GetBytes(text)).ToArray();
        var path = Path.Combine(Path.GetTempPath(), $"modalchain-utf16-{Guid.NewGuid():N}.yaml");
        File.WriteAllBytes(path, bytes);
        try
        {
            var r = ModelReader.ReadFile(path);
            Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
            Assert.Equal("Bühne", r.Model!.Network.Title);
            Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(bytes)), r.Model.Sha256);
        }
        finally { File.Delete(path); }
    }
}
