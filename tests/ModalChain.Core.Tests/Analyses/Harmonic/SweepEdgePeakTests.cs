using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>A response still rising at an end of the sweep is flagged, never reported as a peak.</summary>
public class SweepEdgePeakTests
{
    // Single mass: m = 50 kg, k = 2e5 N/m (f_n = 10.066 Hz), ζ = 2 %. Closed form of the SDOF receptance:
    // |X| k / F = 1/√((1 − r²)² + (2ζr)²), rising monotonically for r < √(1 − 2ζ²) and falling above it
    // (Rao, Mechanical Vibrations, §3.4 [from memory]; common practice).
    private const double M = 50, K = 2e5, Zeta = 0.02;
    private static readonly double Fn = Math.Sqrt(K / M) / (2 * Math.PI);

    private static double ClosedForm(double fHz)
    {
        var r = fHz / Fn;
        return 1 / (K * Math.Sqrt(Math.Pow(1 - r * r, 2) + Math.Pow(2 * Zeta * r, 2)));
    }

    private static (HarmonicResult Result, DampedSystemHolder System) Sweep(double from, double to)
    {
        var system = HarmonicModels.System(HarmonicModels.Sdof(M, K, Zeta), null, new ForceLoad("f", "m", 1, 0));
        var spec = new HarmonicSpec([], new FrequencyRange(from, to, 101, FrequencySpacing.Linear), false, [], HarmonicMethod.Direct);
        return (HarmonicAnalysis.Solve(system, spec), new DampedSystemHolder(system));
    }

    private sealed record DampedSystemHolder(ModalChain.Core.Assembly.DampedSystem System);

    [Fact]
    public void ResonanceAboveTheSweep_IsFlaggedAsRisingAtTheEnd()
    {
        var (result, holder) = Sweep(1, 0.5 * Fn);
        var peak = result.Peaks().Single(p => p.Quantity == ResponseQuantity.Displacement);
        Assert.Equal(SweepEdge.End, peak.RisingAt);
        Assert.False(peak.IsInterior);
        Assert.Equal("rising at the end of the sweep: widen the range", peak.EdgeWarning);
        NumericAssert.Close(ClosedForm(0.5 * Fn), peak.EdgeMagnitude, Tolerance.Rel(1e-9), "value at the sweep's end");

        var search = HarmonicAnalysis.PeakResponse(holder.System, holder.System.Model.Loads, "m", 1, 0.5 * Fn, 50);
        Assert.Equal(SweepEdge.End, search.RisingAt);
        NumericAssert.Close(ClosedForm(0.5 * Fn), search.LargestComputed, Tolerance.Rel(1e-9), "largest computed = end value");
    }

    [Fact]
    public void ResonanceBelowTheSweep_IsFlaggedAsRisingAtTheStart()
    {
        var (result, holder) = Sweep(1.5 * Fn, 3 * Fn);
        var peak = result.Peaks().Single(p => p.Quantity == ResponseQuantity.Displacement);
        Assert.Equal(SweepEdge.Start, peak.RisingAt);
        Assert.Equal("rising at the start of the sweep: widen the range", peak.EdgeWarning);
        NumericAssert.Close(ClosedForm(1.5 * Fn), peak.EdgeMagnitude, Tolerance.Rel(1e-9), "value at the sweep's start");
        Assert.Equal(SweepEdge.Start, HarmonicAnalysis.PeakResponse(holder.System, holder.System.Model.Loads, "m", 1.5 * Fn, 3 * Fn, 50).RisingAt);
    }

    [Fact]
    public void ResonanceInsideTheSweep_IsAPeakWithoutFlag()
    {
        // Peak of the closed form at r = √(1 − 2ζ²), value 1/(2ζ√(1 − ζ²)) / k; golden-section refinement to 1e-7.
        var (_, holder) = Sweep(0.5 * Fn, 1.5 * Fn);
        var peak = HarmonicAnalysis.PeakResponse(holder.System, holder.System.Model.Loads, "m", 0.5 * Fn, 1.5 * Fn, 50);
        Assert.Equal(SweepEdge.None, peak.RisingAt);
        Assert.Null(peak.EdgeWarning);
        NumericAssert.Close(1 / (2 * Zeta * Math.Sqrt(1 - Zeta * Zeta)) / K, peak.Magnitude, Tolerance.Rel(1e-9), "resonant peak");
        NumericAssert.Close(Fn * Math.Sqrt(1 - 2 * Zeta * Zeta), peak.FrequencyHz, Tolerance.Rel(1e-5), "peak frequency");
    }

    [Fact]
    public void AnInteriorPeakBelowAnEndValue_IsReportedWithTheFlag()
    {
        // Samples 3, 5, 4, 6: the interior peak 5 is the peak; the end value 6 is flagged, not reported as the peak.
        var peak = ResponsePeak.Of("m", ResponseQuantity.Displacement, [1.0, 2, 3, 4], [3.0, 5, 4, 6]);
        Assert.Equal(5, peak.Magnitude);
        Assert.Equal(2, peak.FrequencyHz);
        Assert.Equal(SweepEdge.End, peak.RisingAt);
        Assert.Equal(6, peak.EdgeMagnitude);
        Assert.True(peak.IsInterior);
    }
}
