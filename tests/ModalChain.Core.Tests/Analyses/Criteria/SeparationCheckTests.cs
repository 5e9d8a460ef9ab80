using ModalChain.Core.Analyses.Criteria;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Criteria;

// The rule checked is the common-practice separation criterion (REFERENCES §8 [common practice]): no natural
// frequency within ±margin of speed × order. The expected values are the definition applied by hand.
public class SeparationCheckTests
{
    private static SeparationCriterion Rule(double margin, double[] speedsHz, double[] orders) => new(margin, [.. speedsHz], [.. orders]);

    [Theory]
    [InlineData(15.0, true)]             // exactly on the lower edge (1 − 0.25)·20: passes
    [InlineData(25.0, true)]             // exactly on the upper edge (1 + 0.25)·20: passes
    [InlineData(14.999999, true)]
    [InlineData(25.000001, true)]
    [InlineData(15.000001, false)]
    [InlineData(24.999999, false)]
    [InlineData(20.0, false)]
    public void ExactBoundaries_AreOutsideTheBand(double fn, bool passes)
    {
        // Margin 25 % and 20 Hz make both edges exact in binary floating point.
        var result = SeparationCheck.Evaluate([fn], Rule(0.25, [20.0], [1.0]));
        Assert.Equal(passes, result.Passes);
        if (fn is 15.0 or 25.0) Assert.Equal(0.0, result.Reserve);
    }

    [Fact]
    public void ComputedEdgesAtTwentyPercent_PassWithZeroReserve()
    {
        // 1480 rpm × 2 at ±20 %: edges 1.2 × 49.333 Hz and 0.8 × 49.333 Hz are not exact in binary; a frequency
        // computed as the edge still counts as on it (1e-12 relative), one 1e-9 inside does not.
        const double speed = 1480.0 / 60;
        var rule = Rule(0.20, [speed], [2.0]);
        foreach (var edge in new[] { 1.2 * 2 * speed, 0.8 * 2 * speed })
        {
            var on = SeparationCheck.Evaluate([edge], rule);
            Assert.True(on.Passes, $"edge {edge}");
            Assert.Equal(0.0, on.Reserve);
        }
        Assert.False(SeparationCheck.Evaluate([1.2 * 2 * speed * (1 - 1e-9)], rule).Passes);
        Assert.False(SeparationCheck.Evaluate([0.8 * 2 * speed * (1 + 1e-9)], rule).Passes);
    }

    [Fact]
    public void Reserve_IsTheRelativeShiftToTheNearestEdge()
    {
        var rule = Rule(0.25, [20.0], [1.0]);
        NumericAssert.Close(5.0 / 30, SeparationCheck.Evaluate([30.0], rule).Reserve, Tolerance.Rel(1e-14), "above: (30 − 25)/30");
        NumericAssert.Close(3.0 / 12, SeparationCheck.Evaluate([12.0], rule).Reserve, Tolerance.Rel(1e-14), "below: (15 − 12)/12");
        NumericAssert.Close(-2.0 / 23, SeparationCheck.Evaluate([23.0], rule).Reserve, Tolerance.Rel(1e-14), "inside: −(25 − 23)/23");
        NumericAssert.Close(-1.0 / 16, SeparationCheck.Evaluate([16.0], rule).Reserve, Tolerance.Rel(1e-14), "inside: −(16 − 15)/16");
        Assert.Equal(double.PositiveInfinity, SeparationCheck.Evaluate([0.0], rule).Reserve);
    }

    [Fact]
    public void SeveralSpeedsAndOrders_EveryPairIsCheckedAndTheWorstGoverns()
    {
        // Speeds 10 and 25 Hz, orders 1, 2, 3 → excitations 10, 20, 30, 25, 50, 75 Hz at ±10 %.
        var rule = Rule(0.10, [10.0, 25.0], [1.0, 2.0, 3.0]);
        var result = SeparationCheck.Evaluate([8.0, 40.0, 74.0], rule);
        Assert.Equal(3 * 6, result.Pairs.Length);
        Assert.False(result.Passes);
        var failing = result.Pairs.Where(p => !p.Passes).ToList();
        var only = Assert.Single(failing);
        Assert.Equal((3, 25.0, 3.0), (only.ModeNumber, only.SpeedHz, only.Order));
        NumericAssert.Close(75.0, only.ExcitationHz, Tolerance.Rel(1e-15));
        NumericAssert.Close(1.0 / 75, only.Separation, Tolerance.Rel(1e-12), "|74/75 − 1|");
        Assert.Same(result.Governing, result.Pairs.MinBy(p => p.Reserve));
        NumericAssert.Close((74 - 67.5) / 74, -result.Reserve, Tolerance.Rel(1e-12), "governing reserve −(74 − 67.5)/74");
        NumericAssert.Close(result.Reserve, SeparationCheck.GoverningReserve([8.0, 40.0, 74.0], rule), Tolerance.Rel(0));
    }

    [Fact]
    public void AllClear_Passes()
    {
        var result = SeparationCheck.Evaluate([5.0, 40.0], Rule(0.2, [24.0], [1.0]));
        Assert.True(result.Passes);
        NumericAssert.Close((40 - 28.8) / 40, result.Reserve, Tolerance.Rel(1e-12), "governing reserve");
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(1.0)]
    [InlineData(-0.2)]
    public void MarginOutsideZeroToOne_IsACallerBug(double margin) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => SeparationCheck.Evaluate([10.0], Rule(margin, [20.0], [1.0])));
}
