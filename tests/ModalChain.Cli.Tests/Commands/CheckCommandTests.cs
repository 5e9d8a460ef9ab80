using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

public class CheckCommandTests
{
    [Fact]
    public void PassingModel_ExitsZeroAndPrintsItsReserve()
    {
        // beams 150 kN/mm: deck mode about 38 Hz, clear of 24.5 and 49 Hz by more than 20 %.
        var run = CommandRun.Of("check", CommandRun.Deck("150 kN/mm"));
        Assert.Equal(0, run.ExitCode);
        Assert.Contains("all criteria pass", run.Output);
        Assert.Contains("reserve [%]", run.Output);
        Assert.Contains("Caution:", run.Output);
    }

    [Fact]
    public void FailingModel_ExitsOne()
    {
        var run = CommandRun.Of("check", CommandRun.Deck("68 kN/mm"));
        Assert.Equal(1, run.ExitCode);
        Assert.Contains("FAIL", run.Output);
    }

    [Fact]
    public void Json_IsOneObjectWithPairsAndReserves()
    {
        var run = CommandRun.Of("check", CommandRun.Deck("68 kN/mm"), "--format", "json");
        Assert.Equal(1, run.ExitCode);
        var json = run.Json();
        Assert.False(json.GetProperty("passes").GetBoolean());
        var sep = json.GetProperty("separation");
        Assert.Equal(2 * 2, sep.GetProperty("pairs").GetArrayLength()); // 2 modes × 1 speed × 2 orders
        NumericAssert.Close(0.2, sep.GetProperty("margin").GetDouble(), Tolerance.Rel(1e-15));
        Assert.True(sep.GetProperty("reserve").GetDouble() < 0);
        Assert.Contains("licensed engineer", json.GetProperty("caution").GetString());
    }

    [Fact]
    public void ModelWithoutCriteria_ExitsTwo()
    {
        var path = CommandRun.ModelFile("masses:\n  deck: 100 kg\nsprings:\n  s: {between: [ground, deck], stiffness: 1e5}\n");
        var run = CommandRun.Of("check", path);
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("no 'criteria' section", run.Error);
    }

    [Fact]
    public void BadCriteria_ExitTwoWithPositions()
    {
        var path = CommandRun.Deck("68 kN/mm", extra: "  limits:\n    - {at: roof, quantity: velocity, peak: 4 mm/s}");
        var run = CommandRun.Of("check", path);
        Assert.Equal(2, run.ExitCode);
        Assert.Contains($"{path}:11:12: error:", run.Error);
    }

    [Fact]
    public void ExampleModel_IsCheckedEndToEnd()
    {
        var run = CommandRun.Of("check", Path.Combine(CommandRun.Models(), "mezzanine-fan-absorber-check.yaml"), "--format", "json");
        Assert.Contains(run.ExitCode, new[] { 0, 1 });
        Assert.Equal("Supply fan on a steel mezzanine", run.Json().GetProperty("title").GetString());
    }

    [Fact]
    public void LimitsWithoutOperatingPoint_AreNotEvaluated_AndExitOne()
    {
        // A criterion that was not shown to pass does not pass (docs/criteria.md).
        var path = CommandRun.Deck("150 kN/mm", extra: "  limits:\n    - {at: deck, quantity: velocity, peak: 4 mm/s}");
        var run = CommandRun.Of("check", path);
        Assert.Equal(1, run.ExitCode);
        Assert.Contains("NOT EVALUATED", run.Output);
        Assert.Contains("no load with a running speed", run.Output);
    }
}
