using ModalChain.Core.Analyses.Harmonic;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

public class FrequencyGridTests
{
    [Fact]
    public void ExplicitList_IsComputedExactlyInItsOrder()
    {
        var f = FrequencyGrid.Build(new FrequencyList([24.7, 12, 50]), true, [12.1, 24.6], [0.02, 0.02]);
        Assert.Equal([24.7, 12, 50], f.ToArray());
    }

    [Fact]
    public void LogRange_HasItsEndsAndEqualRatios()
    {
        // Definition of logarithmic spacing (common practice); tolerance 1e-12 rel.
        var f = FrequencyGrid.Build(new FrequencyRange(1, 100, 5, FrequencySpacing.Logarithmic), false, [], []);
        NumericAssert.Close([1, Math.Sqrt(10), 10, Math.Sqrt(1000), 100], f.ToArray(), Tolerance.Rel(1e-12), "points");
    }

    [Fact]
    public void Refine_AddsPointsAroundNaturalFrequenciesInRangeOnly()
    {
        var coarse = FrequencyGrid.Build(new FrequencyRange(1, 60, 60, FrequencySpacing.Linear), false, [7.3, 80], [0.02, 0.02]);
        var fine = FrequencyGrid.Build(new FrequencyRange(1, 60, 60, FrequencySpacing.Linear), true, [7.3, 80], [0.02, 0.02]);
        Assert.Equal(60, coarse.Length);
        Assert.True(fine.Length > coarse.Length);
        Assert.Contains(7.3, fine);
        Assert.True(fine.Count(x => Math.Abs(x - 7.3) < 0.5) >= 10, "points near 7.3 Hz");
        Assert.True(fine.Zip(fine.Skip(1)).All(p => p.Second > p.First), "ascending, no duplicates");
        Assert.True(fine.All(x => x is >= 1 and <= 60));
    }
}
