using System.Globalization;
using ModalChain.Core;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Dofs;
using ModalChain.Core.Assembly;
using ModalChain.Io.Model;
using ModalChain.Io.Text;
using ModalChain.Reports.Units;

namespace ModalChain.Cli.Formatting;

/// <summary>The human-readable harmonic report of a model with load cases: each case's sweep, then their combination at the operating points.</summary>
internal static class HarmonicCaseTable
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static void Write(TextWriter o, ModelDocument document, DampedSystem system, LoadCaseResult result, DisplayUnits units)
    {
        var (du, vu, au) = (units.Displacement, units.Velocity, units.Acceleration);
        o.WriteLine(TerminalText.Line(document.Network.Title));
        o.WriteLine(string.Create(Inv, $"Harmonic response by load case: {result.Cases.Length} case{(result.Cases.Length == 1 ? "" : "s")}, each swept on its own, combined at the running speeds by the {LoadCaseSelection.Name(result.Rule)} rule"));
        foreach (var c in result.Cases)
            o.WriteLine($"  {c.Case.Name}: {string.Join("; ", c.Case.Loads.Select(n => HarmonicTable.Describe(system.Model.FindLoad(n)!, units)))}");
        foreach (var c in result.Cases)
        {
            o.WriteLine();
            o.WriteLine(new string('=', 72));
            HarmonicTable.Write(o, document, system, c.Result, units, c.Case.Name);
        }

        o.WriteLine();
        o.WriteLine(new string('=', 72));
        o.WriteLine($"Combination of the load cases at their running speeds, rule: {LoadCaseSelection.Name(result.Rule)}");
        var combined = new TextTable("output", $"displacement [{du.Plain} peak, {Rule(result)}]", $"velocity [{vu.Plain} peak, {Rule(result)}]",
            $"velocity [{vu.Plain} rms, {Rule(result)}]", $"acceleration [{au.Plain} peak, {Rule(result)}]", "components");
        var isRotation = DofMap.RotationLabels(document.Network);
        var translations = result.Combined.Where(r => !isRotation(r.Dof)).ToArray();
        var rotations = result.Combined.Where(r => isRotation(r.Dof)).Select(r => r.Dof).ToArray();
        foreach (var r in translations)
            combined.Add(r.Dof,
                HarmonicTable.Num(du.From(r.Peak(ResponseQuantity.Displacement, result.Rule))),
                HarmonicTable.Num(vu.From(r.Peak(ResponseQuantity.Velocity, result.Rule))),
                HarmonicTable.Num(vu.From(r.Rms(ResponseQuantity.Velocity, result.Rule))),
                HarmonicTable.Num(au.From(r.Peak(ResponseQuantity.Acceleration, result.Rule))),
                r.Components.Length.ToString(Inv));
        combined.Write(o);
        o.WriteLine();
        var parts = new TextTable("output", "case", "speed [Hz]", "speed [rpm]", $"displacement [{du.Plain} peak]", $"velocity [{vu.Plain} peak]", $"velocity [{vu.Plain} rms]", $"acceleration [{au.Plain} peak]");
        foreach (var r in translations)
            foreach (var c in r.Components)
                parts.Add(r.Dof, c.Case, c.SpeedHz.ToString("G6", Inv), (60 * c.SpeedHz).ToString("G6", Inv),
                    HarmonicTable.Num(du.From(c.Peak(ResponseQuantity.Displacement))), HarmonicTable.Num(vu.From(c.Peak(ResponseQuantity.Velocity))),
                    HarmonicTable.Num(vu.From(c.Peak(ResponseQuantity.Velocity)) / Math.Sqrt(2)), HarmonicTable.Num(au.From(c.Peak(ResponseQuantity.Acceleration))));
        parts.Write(o);
        if (rotations.Length > 0)
            o.WriteLine($"Rotations ({string.Join(", ", rotations)}) are angles and are left out of these length tables; their combined values are in --format json (rad, rad/s, rad/s^2).");
        o.WriteLine();
        o.WriteLine("Rule " + LoadCaseSelection.Describe(result.Rule) + ".");
        foreach (var n in result.Notes) o.WriteLine("Note: " + n + ".");
        o.WriteLine();
        o.WriteLine("Caution: " + Cautions.Text);
    }

    private static string Rule(LoadCaseResult result) => LoadCaseSelection.Name(result.Rule);
}
