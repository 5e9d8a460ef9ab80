using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

public class StudyCommandTests
{
    [Fact]
    public void Json_ListsTrackedModesAndThresholds()
    {
        var run = CommandRun.Of("study", CommandRun.Deck("68 kN/mm"), "--vary", "springs.beams.stiffness", "--from", "40 kN/mm", "--to", "140 kN/mm", "--steps", "11", "--format", "json");
        Assert.Equal(0, run.ExitCode);
        var json = run.Json();
        Assert.Equal("springs.beams.stiffness", json.GetProperty("parameter").GetString());
        Assert.Equal(11, json.GetProperty("values").GetArrayLength());
        NumericAssert.Close(40e6, json.GetProperty("values")[0].GetDouble(), Tolerance.Rel(1e-15));
        Assert.Equal(2, json.GetProperty("modes").GetArrayLength());
        var thresholds = json.GetProperty("thresholds");
        Assert.True(thresholds.GetArrayLength() >= 1);
        var t = thresholds[0];
        Assert.InRange(t.GetProperty("value").GetDouble(), t.GetProperty("bracket")[0].GetDouble(), t.GetProperty("bracket")[1].GetDouble());
    }

    [Fact]
    public void Table_PrintsThresholdsInTheUsersUnit()
    {
        var run = CommandRun.Of("study", CommandRun.Deck("68 kN/mm"), "--vary", "springs.beams.stiffness", "--from", "40 kN/mm", "--to", "140 kN/mm", "--steps", "11");
        Assert.Equal(0, run.ExitCode);
        Assert.Contains("starts passing at", run.Output);
        Assert.Contains("kN/mm", run.Output);
        Assert.Equal("", run.Error.Trim()); // no progress bar when stderr is not a terminal
    }

    [Fact]
    public void Table_ShowsTheVariedValueInTheFilesUnit_OrTheUnitsOfUnits()
    {
        // The model writes stiffness in kN/mm; --from and --to typed in kN/m. 40 000 kN/m = 40 kN/mm and
        // 1 lbf/in = 4.4482216152605 N / 0.0254 m = 175.126835 N/m (exact definitions of the pound-force and inch;
        // common practice), so 40 kN/mm = 228 406 lbf/in to six digits.
        var path = CommandRun.Deck("68 kN/mm");
        var si = CommandRun.Of("study", path, "--vary", "springs.beams.stiffness", "--from", "40000 kN/m", "--to", "140000 kN/m", "--steps", "3");
        Assert.Equal(0, si.ExitCode);
        Assert.Contains("Study of springs.beams.stiffness from 40 kN/mm to 140 kN/mm", si.Output, StringComparison.Ordinal);
        Assert.Contains("springs.beams.stiffness [kN/mm]", si.Output, StringComparison.Ordinal);
        Assert.Matches(@"\n\s+40\s+\d", si.Output);
        Assert.DoesNotContain("kN/m ", si.Output, StringComparison.Ordinal);
        var imperial = CommandRun.Of("study", path, "--vary", "springs.beams.stiffness", "--from", "40000 kN/m", "--to", "140000 kN/m", "--steps", "3", "--units", "imperial");
        Assert.Equal(0, imperial.ExitCode);
        Assert.Contains("springs.beams.stiffness [lbf/in]", imperial.Output, StringComparison.Ordinal);
        Assert.Matches(@"\n\s+228406\s+\d", imperial.Output);
    }

    [Fact]
    public void Csv_HasOneRowPerValue()
    {
        var run = CommandRun.Of("study", CommandRun.Deck("68 kN/mm"), "--vary", "masses.fan.mass", "--from", "200 kg", "--to", "800 kg", "--steps", "7", "--format", "csv");
        Assert.Equal(0, run.ExitCode);
        var lines = run.Output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(1 + 7, lines.Length);
        Assert.StartsWith("masses.fan.mass [kg]", lines[0]);
    }

    [Theory]
    [InlineData("springs.roof.stiffness", "50 kN/mm", "100 kN/mm", "no entry 'roof'")]
    [InlineData("springs.beams.between", "50 kN/mm", "100 kN/mm", "not a numeric field")]
    [InlineData("masses.deck.at", "1 m", "2 m", "not a numeric field")]
    [InlineData("springs.beams.stiffness", "50 kN/mm", "50 kN/mm", "a study needs a range")]
    [InlineData("springs.beams.stiffness", "50 kg", "100 kN/mm", "--from")]
    [InlineData("masses.deck.mass", "0 kg", "100 kg", "not a valid value")]
    public void BadInputs_ExitTwoWithAClearMessage(string vary, string from, string to, string expected)
    {
        var run = CommandRun.Of("study", CommandRun.Deck("68 kN/mm"), "--vary", vary, "--from", from, "--to", to);
        Assert.Equal(2, run.ExitCode);
        Assert.Contains(expected, run.Error);
    }

    [Fact]
    public void SpeedChart_ListsCrossingsAtNaturalFrequencyOverOrder()
    {
        var path = CommandRun.Deck("68 kN/mm");
        var modes = CommandRun.Of("modes", path, "--format", "json").Json().GetProperty("modes");
        var run = CommandRun.Of("study", path, "--vary", "speed", "--from", "0 rpm", "--to", "3000 rpm", "--steps", "61", "--format", "json");
        Assert.Equal(0, run.ExitCode);
        var json = run.Json();
        Assert.Equal(61, json.GetProperty("speeds_rpm").GetArrayLength());
        foreach (var c in json.GetProperty("crossings").EnumerateArray())
        {
            var f = modes[c.GetProperty("mode").GetInt32() - 1].GetProperty("frequency_hz").GetDouble();
            NumericAssert.Close(f / c.GetProperty("order").GetDouble() * 60, c.GetProperty("speed_rpm").GetDouble(), Tolerance.Rel(1e-12), "speed = f_n/h");
        }
        Assert.True(json.GetProperty("crossings").GetArrayLength() >= 3);
    }

    [Fact]
    public void SpeedChart_BadRange_ExitsTwo()
    {
        var run = CommandRun.Of("study", CommandRun.Deck("68 kN/mm"), "--vary", "speed", "--from", "1500 rpm", "--to", "1500 rpm");
        Assert.Equal(2, run.ExitCode);
    }
}
