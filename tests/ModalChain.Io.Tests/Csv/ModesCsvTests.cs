using System.Globalization;
using ModalChain.Io.Csv;
using ModalChain.Io.Tests.Json;
using ModalChain.TestSupport;

namespace ModalChain.Io.Tests.Csv;

/// <summary>The CSV of <c>modes --format csv</c>: units in the header, one row per mode, invariant numbers.</summary>
public class ModesCsvTests
{
    private static string Write(Core.Analyses.Modal.ModalResult result)
    {
        using var w = new StringWriter(CultureInfo.InvariantCulture);
        ModesCsv.Write(w, result);
        return w.ToString();
    }

    [Fact]
    public void Header_HasUnits_AndThereIsOneRowPerMode()
    {
        var (_, result) = ModesJsonTests.Solve(ModesJsonTests.CaseA);
        var lines = Write(result).Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(
            "mode,frequency [Hz],omega [rad/s],period [s],participation [kg^0.5],effective mass [kg],effective mass fraction [1],cumulative fraction [1],shape m1 [kg^-0.5],shape m2 [kg^-0.5]",
            lines[0]);
        Assert.Equal(1 + result.Modes.Length, lines.Length);
        var columns = lines[0].Split(',').Length;
        for (var i = 1; i < lines.Length; i++)
        {
            var fields = lines[i].Split(',');
            Assert.Equal(columns, fields.Length);
            Assert.Equal(i, int.Parse(fields[0], CultureInfo.InvariantCulture));
            var mode = result.Modes[i - 1];
            // "R" formatting round-trips exactly.
            Assert.Equal(mode.NaturalFrequencyHz, double.Parse(fields[1], CultureInfo.InvariantCulture));
            Assert.Equal(mode.EffectiveModalMass, double.Parse(fields[5], CultureInfo.InvariantCulture));
            Assert.Equal(mode.Shape[1], double.Parse(fields[9], CultureInfo.InvariantCulture));
        }
        // Case A of REFERENCES.md §1 (Rao 5th ed. Ex. 5.3; values recomputed; attribution from memory): ω1 = 1.581139 rad/s.
        NumericAssert.Close(1.581139, double.Parse(lines[1].Split(',')[2], CultureInfo.InvariantCulture), Tolerance.Rel(1e-6), "ω1");
    }

    [Fact]
    public void RigidBodyMode_HasAnEmptyPeriod()
    {
        var (_, result) = ModesJsonTests.Solve("masses:", "  cart: 400 kg", "  load: 100 kg", "springs:", "  coupler: {between: [cart, load], stiffness: 20 kN/m}");
        var row = Write(result).Split('\n')[1].Split(',');
        Assert.Equal("", row[3]);
        Assert.Equal(0.0, double.Parse(row[1], CultureInfo.InvariantCulture));
    }

    [Fact]
    public void Output_IsIdenticalUnderADecimalCommaCulture()
    {
        var (_, result) = ModesJsonTests.Solve(ModesJsonTests.CaseA);
        var invariant = Write(result);
        string german;
        using (new CultureScope("de-DE")) german = Write(result);
        Assert.Equal(invariant, german);
    }

    [Fact]
    public void NamesWithCommas_WouldBeQuoted()
    {
        // Mass names cannot hold commas (the reader rejects them), but the writer must not rely on that.
        Assert.Equal("\"a,b\"", CsvText.Field("a,b"));
        Assert.Equal("\"say \"\"hi\"\"\"", CsvText.Field("say \"hi\""));
        Assert.Equal("plain", CsvText.Field("plain"));
    }
}
