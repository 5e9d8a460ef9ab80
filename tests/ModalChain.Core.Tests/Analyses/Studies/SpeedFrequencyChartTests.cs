using ModalChain.Core.Analyses.Studies;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Studies;

// Order line h meets natural frequency f_n at running speed s = f_n/h (definition of an order line, common practice).
public class SpeedFrequencyChartTests
{
    [Fact]
    public void Crossings_AreAtNaturalFrequencyOverOrder_WithinTheRange()
    {
        var chart = SpeedFrequencyChart.Build([(1, 0.0), (2, 9.0), (3, 30.0)], 0, 25, 26, [1, 2, 3]);
        // 9/1, 9/2, 9/3, 30/2, 30/3 are inside [0, 25] Hz; 30/1 is not; the rigid-body mode is left out.
        var expected = new[] { (2, 3.0, 3.0), (2, 2.0, 4.5), (2, 1.0, 9.0), (3, 3.0, 10.0), (3, 2.0, 15.0) };
        Assert.Equal(expected.Length, chart.Crossings.Length);
        for (var i = 0; i < expected.Length; i++)
        {
            Assert.Equal(expected[i].Item1, chart.Crossings[i].ModeNumber);
            Assert.Equal(expected[i].Item2, chart.Crossings[i].Order);
            NumericAssert.Close(expected[i].Item3, chart.Crossings[i].SpeedHz, Tolerance.Rel(1e-15), $"crossing {i}");
        }
        Assert.Equal([2, 3], chart.ModeNumbers.ToArray());
        Assert.Equal(26, chart.SpeedsHz.Length);
        NumericAssert.Close(25.0, chart.SpeedsHz[^1], Tolerance.Rel(1e-15));
    }

    [Fact]
    public void DecreasingRange_IsACallerBug() =>
        Assert.Throws<ArgumentException>(() => SpeedFrequencyChart.Build([(1, 5.0)], 10, 5, 10, [1]));
}
