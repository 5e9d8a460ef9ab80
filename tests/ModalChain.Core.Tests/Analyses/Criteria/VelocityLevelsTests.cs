using System.Numerics;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Criteria;

// Band levels, band edges, zone boundaries and a floor criterion on a single degree of freedom, each against a hand
// computation or a closed form.
public class VelocityLevelsTests
{
    // A component whose velocity amplitude is v (m/s) at f (Hz): |X| = v/ω.
    private static HarmonicComponent WithPeakVelocity(double f, double v) => new(f, new Complex(v / (2 * Math.PI * f), 0));

    [Fact]
    public void SinusoidOfOneMillimetrePerSecondPeak_IsPointSevenZeroSevenOneRms()
    {
        // The r.m.s. value of a sinusoid is its peak over √2 (common practice).
        NumericAssert.Close(0.70710678e-3, VelocityLevels.RmsVelocity(WithPeakVelocity(31.5, 1e-3)), Tolerance.Rel(1e-8), "v_rms");
    }

    [Fact]
    public void TwoSinusoidsInOneBand_AddAsRootSumOfSquares_AndAThirdStaysInItsOwnBand()
    {
        // 45 and 55 Hz both lie in the 50 Hz band (edges 44.67-56.23 Hz); 25 Hz is in the 25 Hz band (22.39-28.18 Hz).
        // Hand computation: band 50 Hz: √((2/√2)² + (3/√2)²) = √(6.5) = 2.549510 mm/s; band 25 Hz: 4/√2 = 2.828427 mm/s.
        var bands = VelocityLevels.BandLevels([WithPeakVelocity(45, 2e-3), WithPeakVelocity(25, 4e-3), WithPeakVelocity(55, 3e-3)]);
        Assert.Equal([14, 17], bands.Select(b => b.Band).ToArray());
        NumericAssert.Close(2.828427e-3, bands[0].RmsVelocity, Tolerance.Rel(1e-6), "25 Hz band");
        NumericAssert.Close(2.549510e-3, bands[1].RmsVelocity, Tolerance.Rel(1e-6), "50 Hz band");
    }

    [Theory]
    [InlineData(16)]  // edge 44.67 Hz between the 40 and 50 Hz bands
    [InlineData(8)]   // edge 7.079 Hz between the 6.3 and 8 Hz bands
    [InlineData(0)]   // edge 1.122 Hz between the 1 and 1.25 Hz bands
    public void BandEdges_FollowTheBaseTenDefinition_AndAnEdgeBelongsToTheBandAbove(int band)
    {
        // Base-10 one-third-octave bands: edges f_c·10^(±1/20) (IEC 61260 / ANSI S1.11 [common practice]).
        var edge = ThirdOctaveBands.UpperEdgeHz(band);
        NumericAssert.Close(ThirdOctaveBands.CentreHz(band) * Math.Pow(10, 0.05), edge, Tolerance.Rel(1e-14), "upper edge");
        NumericAssert.Close(ThirdOctaveBands.LowerEdgeHz(band + 1), edge, Tolerance.Rel(1e-14), "shared edge");
        Assert.Equal(band, ThirdOctaveBands.BandOf(edge * (1 - 1e-8)));
        Assert.Equal(band + 1, ThirdOctaveBands.BandOf(edge));
        Assert.Equal(band + 1, ThirdOctaveBands.BandOf(edge * (1 + 1e-8)));
        Assert.Equal(band, ThirdOctaveBands.BandOf(ThirdOctaveBands.CentreHz(band)));
    }

    [Fact]
    public void NominalCentres_AreThePrintedPreferredNumbers()
    {
        // Nominal one-third-octave centres (IEC 61260 [common practice]).
        Assert.Equal([8, 10, 12.5, 16, 20, 25, 31.5, 40, 50, 63, 80], Enumerable.Range(9, 11).Select(n => Math.Round(ThirdOctaveBands.NominalHz(n), 6)).ToArray());
        Assert.Equal(1.0, ThirdOctaveBands.NominalHz(0));
    }

    [Theory]
    [InlineData(1.4e-3, 'A')]
    [InlineData(1.4000001e-3, 'B')]
    [InlineData(2.8e-3, 'B')]
    [InlineData(2.8000001e-3, 'C')]
    [InlineData(4.5e-3, 'C')]
    [InlineData(4.5000001e-3, 'D')]
    [InlineData(0.0, 'A')]
    public void ZoneClassification_AtTheBoundaries_PutsABoundaryValueInTheBetterZone(double rms, char zone)
    {
        // Medium machines on rigid supports: 1.4 / 2.8 / 4.5 mm/s r.m.s. (REFERENCES.md §8: ISO 10816-3 / 20816-3
        // [from memory, medium confidence]).
        var medium = PublishedLevels.MachineClass("medium-rigid")!;
        Assert.Equal(zone, medium.ZoneOf(rms));
    }

    [Fact]
    public void FloorCurves_HaveThePublishedPlateaus_AndConstantAccelerationBelowEightHertz()
    {
        // VC-A..VC-E: 50, 25, 12.5, 6.25, 3.12 µm/s from 8 to 80 Hz (REFERENCES.md §8: Ungar, Sturz & Amick 1990;
        // Gordon 1991 [values from memory, high confidence]).
        Assert.Equal([50e-6, 25e-6, 12.5e-6, 6.25e-6, 3.12e-6], PublishedLevels.FloorCurves.Select(c => c.PlateauVelocity).ToArray());
        var a = PublishedLevels.FloorCurve("vc-a")!;
        Assert.Equal(50e-6, a.LimitInBand(9));
        Assert.Equal(50e-6, a.LimitInBand(19));
        Assert.Null(a.LimitInBand(20));
        Assert.Null(a.LimitInBand(-1));
        // Below 8 Hz constant acceleration (from memory, unverified): v·f is the same in every low band.
        NumericAssert.Close(50e-6 * ThirdOctaveBands.CentreHz(9), a.LimitInBand(3)!.Value * ThirdOctaveBands.CentreHz(3), Tolerance.Rel(1e-14), "v·f constant");
    }

    [Fact]
    public void SdofFloor_UnderAForce_MatchesTheClosedFormVelocity_AgainstTheCurve()
    {
        // SDOF m, k, c under F sin ωt: |V| = ω·F/|k − mω² + icω| (REFERENCES.md §4: Rao ch. 3, Thomson ch. 3 [from memory]).
        // m = 5000 kg, k = 2e8 N/m (f_n = 31.8 Hz), ζ = 3 % modal, F = 200 N at 40 Hz (the 40 Hz band).
        const double m = 5000, k = 2e8, zeta = 0.03, force = 200, f = 40;
        var net = new NetworkBuilder().AddMass("slab", m).AddSpring("support", Network.Ground, "slab", k).Build();
        var system = DampedSystem.Build(new StructuralModel(net, DampingModel.Modal(zeta), [new ForceLoad("press", "slab", force, 0, f)]));
        var curve = PublishedLevels.FloorCurve("VC-A")!;
        var criteria = new CriteriaSet(null, []) { Floors = [new FloorCriterion(["slab"], curve)] };

        var outcome = CriteriaCheck.Evaluate(system, criteria, system.Model.Loads);

        var w = 2 * Math.PI * f;
        var c = 2 * zeta * Math.Sqrt(k * m);
        var vRms = w * force / Complex.Abs(new Complex(k - m * w * w, c * w)) / Math.Sqrt(2);
        var result = Assert.Single(outcome.Floors);
        var band = Assert.Single(result.Bands);
        Assert.Equal(16, band.Band);
        NumericAssert.Close(vRms, band.RmsVelocity, Tolerance.Rel(1e-9), "band r.m.s. velocity, closed form");
        NumericAssert.Close((50e-6 - vRms) / 50e-6, result.Reserve, Tolerance.Rel(1e-9), "reserve");
        Assert.Equal(vRms <= 50e-6, outcome.AllPass);
        Assert.Empty(result.UncomparedHz);
    }

    [Fact]
    public void MachineZone_OnAnSdof_IsTheClosedFormRmsVelocity_AgainstTheAcceptedZone()
    {
        // Same closed form; 2 kN at 25 Hz on m = 800 kg, k = 2e6 N/m, ζ = 2 %: far above resonance, zone from 1.4/2.8/4.5.
        const double m = 800, k = 2e6, zeta = 0.02, force = 2000, f = 25;
        var net = new NetworkBuilder().AddMass("skid", m).AddSpring("mounts", Network.Ground, "skid", k).Build();
        var system = DampedSystem.Build(new StructuralModel(net, DampingModel.Modal(zeta), [new ForceLoad("pump", "skid", force, 0, f)]));
        var medium = PublishedLevels.MachineClass("medium-rigid")!;
        var criteria = new CriteriaSet(null, []) { Zones = [new MachineZoneCriterion(["skid"], medium, 'A')] };

        var outcome = CriteriaCheck.Evaluate(system, criteria, system.Model.Loads);

        var w = 2 * Math.PI * f;
        var vRms = w * force / Complex.Abs(new Complex(k - m * w * w, 2 * zeta * Math.Sqrt(k * m) * w)) / Math.Sqrt(2);
        var zone = Assert.Single(outcome.Zones);
        NumericAssert.Close(vRms, zone.RmsVelocity, Tolerance.Rel(1e-9), "r.m.s. velocity, closed form");
        Assert.Equal(medium.ZoneOf(vRms), zone.Zone);
        NumericAssert.Close((1.4e-3 - vRms) / 1.4e-3, zone.Reserve, Tolerance.Rel(1e-9), "reserve against A/B");
        Assert.Equal(vRms <= 1.4e-3, outcome.AllPass);
    }

    [Fact]
    public void ComponentsAboveTheCurvesRange_AreListedAsNotCompared()
    {
        var result = VelocityLevels.Evaluate(new FloorCriterion(["bench"], PublishedLevels.FloorCurve("VC-E")!), "bench",
            [WithPeakVelocity(120, 1e-3), WithPeakVelocity(50, 1e-6)]);
        Assert.Equal([120.0], result.UncomparedHz.ToArray());
        var band = Assert.Single(result.Bands);
        NumericAssert.Close(1e-6 / Math.Sqrt(2), band.RmsVelocity, Tolerance.Rel(1e-12), "50 Hz band");
        Assert.True(result.Passes);
    }

    [Fact]
    public void WithoutARunningSpeed_NamedCriteriaAreNotEvaluated()
    {
        var net = new NetworkBuilder().AddMass("slab", 1000).AddSpring("s", Network.Ground, "slab", 1e6).Build();
        var system = DampedSystem.Build(new StructuralModel(net, DampingModel.Modal(0.02), [new ForceLoad("p", "slab", 10, 0, null)]));
        var criteria = new CriteriaSet(null, []) { Floors = [new FloorCriterion(["slab"], PublishedLevels.FloorCurve("VC-B")!)] };
        var outcome = CriteriaCheck.Evaluate(system, criteria, system.Model.Loads);
        Assert.False(outcome.AllPass);
        Assert.Contains("no load with a running speed", Assert.Single(outcome.NotEvaluated).Reason, StringComparison.Ordinal);
    }
}
