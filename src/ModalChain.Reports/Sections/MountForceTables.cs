using System.Globalization;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Reports.Html;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Sections;

/// <summary>
/// The mount-force tables of plane and 3d models in the harmonic and transient sections: what each spring and damper
/// passes to its second end, per direction, in the display units (forces in the force unit, moments in force × length).
/// </summary>
/// <remarks>The numbers are those of <c>mount_forces</c> in the section's JSON (SI there); a mount is selected on them,
/// so each table says whether a value is a peak or an r.m.s. value.</remarks>
public static class MountForceTables
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Caption of the harmonic table.</summary>
    public const string HarmonicCaption = "Force each mount passes on: amplitude (peak) per direction, largest over the sweep and at the running speeds";

    /// <summary>Caption of the transient table.</summary>
    public const string TransientCaption = "Force each mount passes on: peak and r.m.s. per direction over the run";

    /// <summary>The display unit of an SI mount value whose JSON unit is <paramref name="siUnit"/> ("N", or "N*m" for a moment).</summary>
    public static string Unit(string siUnit, DisplayUnits units)
    {
        ArgumentNullException.ThrowIfNull(units);
        return IsMoment(siUnit) ? $"{units.Force.Symbol}·{units.LengthUnit.Symbol}" : units.Force.Symbol;
    }

    /// <summary>Below this fraction of the largest value of its table a mount value is rounding noise of the solve (a
    /// direction the load does not excite, such as y under a load in the x–z plane) and is printed as 0.</summary>
    public const double NoiseFraction = 1e-9;

    /// <summary>An SI mount value (N, or N·m for a moment) in the display units, as the tables print it; 0 when its
    /// magnitude is below <see cref="NoiseFraction"/> of <paramref name="largest"/> (SI, the largest of its table).</summary>
    public static string Format(double si, string siUnit, DisplayUnits units, double largest = 0)
    {
        ArgumentNullException.ThrowIfNull(units);
        if (Math.Abs(si) < NoiseFraction * largest) return "0";
        return DisplayUnits.Number(IsMoment(siUnit) ? si / units.Force.Factor / units.LengthUnit.Factor : si / units.Force.Factor);
    }

    /// <summary>Writes the harmonic table (nothing for a line model): per element and direction the largest amplitude
    /// over the sweep with its frequency, and the amplitude at each operating point.</summary>
    public static void WriteHarmonic(HtmlWriter html, HarmonicResult result, DisplayUnits units)
    {
        ArgumentNullException.ThrowIfNull(html);
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(units);
        if (result.MountForces.IsEmpty) return;
        var operating = result.OperatingPoints;
        var headers = new List<string> { "Spring or damper", "Direction", "Unit", "Largest amplitude over the sweep (peak)", "at (Hz)" };
        headers.AddRange(operating.Select(op => string.Create(Inv, $"At {DisplayUnits.Number(op.SpeedHz * 60)} rpm (peak)")));
        var peaks = result.MountForcePeaks();
        var largest = peaks.Max(p => p.Magnitude);
        var rows = peaks.Select(p =>
        {
            var m = p.Force;
            var noise = p.Magnitude < NoiseFraction * largest;
            var row = new List<string> { $"{Kind(m.Kind)} {m.Element}", m.Direction, Unit(m.Unit, units), Format(p.Magnitude, m.Unit, units, largest), noise ? "—" : DisplayUnits.Number(p.FrequencyHz) };
            foreach (var op in operating)
            {
                var at = op.Response.MountForces.FirstOrDefault(o => o.Element == m.Element && o.Kind == m.Kind && o.Direction == m.Direction);
                row.Add(at is null ? "—" : Format(at.Force[0].Magnitude, m.Unit, units, largest));
            }
            return (IReadOnlyList<string>)row;
        });
        html.Table(HarmonicCaption, headers, rows, Enumerable.Range(3, headers.Count - 3).ToHashSet());
        html.Paragraph("Mount forces are the force (a moment for a rotational direction) each spring and damper passes to its second end " +
            "(the second name of its 'between'), per direction of the model; 'axial' acts along the element's line and is also given in its " +
            "x, y, z parts. Values are amplitudes: the peak (zero-to-peak) of the steady sinusoid; its r.m.s. value is peak/√2. A mount's " +
            "rating may be stated either way: compare peak with peak. A value below a billionth of the table's largest is rounding noise and is shown as 0 " +
            "(results.json keeps it as computed).", "note");
    }

    /// <summary>Writes the transient table (nothing for a line model): per element and direction the peak (largest
    /// magnitude, with its sign) and its time, and the r.m.s. value over the run's r.m.s. window.</summary>
    public static void WriteTransient(HtmlWriter html, TransientResult result, DisplayUnits units)
    {
        ArgumentNullException.ThrowIfNull(html);
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(units);
        var mounts = result.Responses.Where(IsMount).ToList();
        if (mounts.Count == 0) return;
        var s = result.Settings;
        var largest = mounts.Max(r => Math.Abs(r.Peak.Value));
        html.Table(TransientCaption,
            ["Spring or damper", "Direction", "Unit", "Peak (largest magnitude, signed)", "at (s)", "r.m.s."],
            mounts.Select(r => (IReadOnlyList<string>)
            [
                $"{(r.Quantity == Core.Analyses.Transient.ResponseQuantity.SpringForce ? "spring" : "damper")} {r.Name}", r.Direction!, Unit(r.Unit, units),
                Format(r.Peak.Value, r.Unit, units, largest), Math.Abs(r.Peak.Value) < NoiseFraction * largest ? "—" : DisplayUnits.Number(r.Peak.Time), double.IsNaN(r.Rms) ? "n/a" : Format(r.Rms, r.Unit, units, largest),
            ]), new HashSet<int> { 3, 4, 5 });
        html.Paragraph(string.Create(Inv,
            $"Mount forces are the force (a moment for a rotational direction) each spring and damper passes to its second end, per direction; the peak is the largest instantaneous magnitude over every step, with its sign; the r.m.s. value is over {DisplayUnits.Number(s.RmsFrom ?? 0)} to {DisplayUnits.Number(s.RmsTo ?? result.StepCount * s.Step)} s. A mount's rating may be a peak or an r.m.s. value: compare like with like. A value below a billionth of the table's largest is rounding noise and is shown as 0 (results.json keeps it as computed)."), "note");
    }

    /// <summary>True for the history of a mount force (a spring's or damper's force in one direction of a plane or 3d model).</summary>
    public static bool IsMount(ResponseHistory history)
    {
        ArgumentNullException.ThrowIfNull(history);
        return history.Direction is not null;
    }

    private static bool IsMoment(string siUnit) => siUnit != "N";

    private static string Kind(ElementKind kind) => kind == ElementKind.Spring ? "spring" : "damper";
}
