using System.Globalization;
using ModalChain.Core;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Cli.Formatting;

/// <summary>The human-readable harmonic report of a model with load cases: each case's sweep, then their combination at the operating points.</summary>
internal static class HarmonicCaseTable
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static void Write(TextWriter o, ModelDocument document, DampedSystem system, LoadCaseResult result)
    {
        o.WriteLine(TerminalText.Line(document.Network.Title));
        o.WriteLine(string.Create(Inv, $"Harmonic response by load case: {result.Cases.Length} case{(result.Cases.Length == 1 ? "" : "s")}, each swept on its own, combined at the running speeds by the {LoadCaseSelection.Name(result.Rule)} rule"));
        foreach (var c in result.Cases)
            o.WriteLine($"  {c.Case.Name}: {string.Join("; ", c.Case.Loads.Select(n => HarmonicTable.Describe(system.Model.FindLoad(n)!)))}");
        foreach (var c in result.Cases)
        {
            o.WriteLine();
            o.WriteLine(new string('=', 72));
            HarmonicTable.Write(o, document, system, c.Result, c.Case.Name);
        }

        o.WriteLine();
        o.WriteLine(new string('=', 72));
        o.WriteLine($"Combination of the load cases at their running speeds, rule: {LoadCaseSelection.Name(result.Rule)}");
        var combined = new TextTable("output", $"displacement [mm peak, {Rule(result)}]", $"velocity [mm/s peak, {Rule(result)}]",
            $"velocity [mm/s rms, {Rule(result)}]", $"acceleration [m/s^2 peak, {Rule(result)}]", "components");
        foreach (var r in result.Combined)
            combined.Add(r.Dof,
                HarmonicTable.Num(1e3 * r.Peak(ResponseQuantity.Displacement, result.Rule)),
                HarmonicTable.Num(1e3 * r.Peak(ResponseQuantity.Velocity, result.Rule)),
                HarmonicTable.Num(1e3 * r.Rms(ResponseQuantity.Velocity, result.Rule)),
                HarmonicTable.Num(r.Peak(ResponseQuantity.Acceleration, result.Rule)),
                r.Components.Length.ToString(Inv));
        combined.Write(o);
        o.WriteLine();
        var parts = new TextTable("output", "case", "speed [Hz]", "speed [rpm]", "displacement [mm peak]", "velocity [mm/s peak]", "velocity [mm/s rms]", "acceleration [m/s^2 peak]");
        foreach (var r in result.Combined)
            foreach (var c in r.Components)
                parts.Add(r.Dof, c.Case, c.SpeedHz.ToString("G6", Inv), (60 * c.SpeedHz).ToString("G6", Inv),
                    HarmonicTable.Num(1e3 * c.Peak(ResponseQuantity.Displacement)), HarmonicTable.Num(1e3 * c.Peak(ResponseQuantity.Velocity)),
                    HarmonicTable.Num(1e3 * c.Peak(ResponseQuantity.Velocity) / Math.Sqrt(2)), HarmonicTable.Num(c.Peak(ResponseQuantity.Acceleration)));
        parts.Write(o);
        o.WriteLine();
        o.WriteLine("Rule " + LoadCaseSelection.Describe(result.Rule) + ".");
        foreach (var n in result.Notes) o.WriteLine("Note: " + n + ".");
        o.WriteLine();
        o.WriteLine("Caution: " + Cautions.Text);
    }

    private static string Rule(LoadCaseResult result) => LoadCaseSelection.Name(result.Rule);
}
