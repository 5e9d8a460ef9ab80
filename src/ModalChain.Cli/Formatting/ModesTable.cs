using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Io.Text;
using ModalChain.Reports.Units;

namespace ModalChain.Cli.Formatting;

/// <summary>The human-readable modes table: frequency, period, effective mass and where each mode lives.</summary>
internal static class ModesTable
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static void Write(TextWriter o, ModalResult result, DisplayUnits units, DampedSystem? damping = null, ImmutableArray<ComplexMode> complexModes = default)
    {
        var n = result.Network;
        o.WriteLine(TerminalText.Line(n.Title));
        o.WriteLine(string.Create(Inv, $"{result.Matrices.Size} degrees of freedom, total mass {units.MassUnit.From(result.TotalMass):G6} {units.MassUnit.Plain}, {result.Modes.Length} mode{(result.Modes.Length == 1 ? "" : "s")}"));
        if (result.Network.Inerters.Length > 0)
            o.WriteLine(string.Create(Inv, $"Total mass is ιᵀMι, inerters included (their grounded terminals add apparent mass); the physical mass of the masses is {units.MassUnit.From(result.Network.TotalMass):G6} {units.MassUnit.Plain}."));
        o.WriteLine();
        var table = new TextTable("mode", "frequency [Hz]", "omega [rad/s]", "period [s]", "damping [%]", "eff. mass [%]", "cumulative [%]", "most strained spring", "where it moves (kinetic energy share)");
        foreach (var m in result.Modes)
        {
            table.Add(
                m.Number.ToString(Inv),
                m.NaturalFrequencyHz.ToString("F4", Inv),
                m.AngularFrequency.ToString("F3", Inv),
                m.IsRigidBody ? "rigid body" : m.PeriodSeconds.ToString("G5", Inv),
                Io.Json.ModesJson.DampingRatioOf(damping, m) is var z && double.IsFinite(z) ? (100 * z).ToString("F2", Inv) : "-",
                (100 * m.EffectiveMassFraction).ToString("F1", Inv),
                (100 * m.CumulativeEffectiveMassFraction).ToString("F1", Inv),
                MostStrained(n, m),
                Dominant(result, m));
        }
        table.Write(o, lastColumnLeftAligned: true);
        o.WriteLine();
        if (n.Space != ModelSpace.Line) WriteDirections(o, result, units);

        var fundamental = result.Modes.FirstOrDefault(m => !m.IsRigidBody);
        if (fundamental is not null && n.Springs.Length > 0 && fundamental.StrainEnergyShare.Any(e => e > 0))
        {
            var i = Enumerable.Range(0, n.Springs.Length).MaxBy(k => fundamental.StrainEnergyShare[k]);
            o.WriteLine(string.Create(Inv,
                $"Mode {fundamental.Number} stores {100 * fundamental.StrainEnergyShare[i]:F0} % of its strain energy in spring '{n.Springs[i].Name}': stiffening it raises that mode most."));
        }
        if (damping is { IsClassical: false } && complexModes.IsDefaultOrEmpty && damping.Partition.FreeCount > Commands.ModesCommand.ComplexModesMaxDofs)
        {
            o.WriteLine();
            o.WriteLine(string.Create(Inv,
                $"The damping is not classical (it couples the modes above, whose damping is then an estimate); complex modes are not computed above {Commands.ModesCommand.ComplexModesMaxDofs} masses."));
        }
        if (!complexModes.IsDefaultOrEmpty)
        {
            o.WriteLine();
            o.WriteLine(damping is { HasFirstOrderStates: true }
                ? "Massless nodes with damping are first-order states: the modes above condense them through their springs only and carry no damping ratio; the damped system's own roots (relaxations included) are these."
                : "The damping is not classical (it couples the modes above, whose damping is then an estimate).");
            o.WriteLine("Complex modes of the damped system (state-space eigenproblem):");
            var complex = new TextTable("root", "undamped [Hz]", "damped [Hz]", "damping [%]");
            foreach (var c in complexModes)
                complex.Add(c.Number.ToString(Inv), c.UndampedFrequencyHz.ToString("F4", Inv),
                    c.Kind switch
                    {
                        ComplexModeKind.RigidBody => "rigid body (zero root)",
                        ComplexModeKind.RigidBodyRelaxation => string.Create(Inv, $"rigid-body relaxation, {-c.EigenValue.Real:G4} 1/s"),
                        ComplexModeKind.Relaxation => string.Create(Inv, $"relaxation, τ = {-1 / c.EigenValue.Real:G4} s"),
                        _ => c.IsOscillatory ? c.DampedFrequencyHz.ToString("F4", Inv) : "overdamped",
                    },
                    c.IsOscillatory ? (100 * c.DampingRatio).ToString("F2", Inv) : "-");
            complex.Write(o);
            if (Topology.FluxLevelCount(result.Network) is var levels and > 0)
                o.WriteLine(string.Create(Inv, $"{levels} root(s) at 0 left out: a circuit node group held by no inductor only sets a constant flux level there, not a motion."));
            o.WriteLine();
        }
        if (result.RigidBodyModeCount > 0)
            o.WriteLine($"{result.RigidBodyModeCount} rigid-body mode(s) at 0 Hz: part of the network is not held by springs.");
        foreach (var w in result.Warnings) o.WriteLine("Warning: " + w);
        o.WriteLine(string.Create(Inv,
            $"Quality: max residual {result.Quality.MaxResidual:0.0E+00}, max M-orthogonality error {result.Quality.MaxOrthogonalityError:0.0E+00} ({result.Algorithm})."));
        o.WriteLine();
        o.WriteLine("Caution: " + Cautions.Text);
    }

    /// <summary>
    /// Plane and 3d models: each mode's motion name, decoupling and kinetic-energy share per direction, then the effective
    /// mass per direction with its cumulative fraction (rotations about the reference point).
    /// </summary>
    private static void WriteDirections(TextWriter o, ModalResult result, DisplayUnits units)
    {
        var directions = result.TotalByDirection.Select(t => t.Direction).ToArray();
        o.WriteLine("Motion of each mode (kinetic energy share per direction; decoupling = the largest share, 1 for a pure motion)");
        var motion = new TextTable(["mode", "motion", "decoupling", .. directions.Select(d => $"KE {d.Label()} [%]")]);
        foreach (var m in result.Modes)
        {
            var shares = directions.Select(d => m.KineticEnergyByDirection.FirstOrDefault(k => k.Direction == d)?.Value ?? 0);
            motion.Add([m.Number.ToString(Inv), m.Motion ?? "-", m.Decoupling.ToString("F3", Inv), .. shares.Select(v => (100 * v).ToString("F1", Inv))]);
        }
        motion.Write(o);
        o.WriteLine();
        var length = units.LengthUnit;
        var about = result.ReferencePoint is { } p
            ? string.Create(Inv, $" about ({length.From(p.X):G4}, {length.From(p.Y):G4}, {length.From(p.Z):G4}) {length.Plain}")
            : "";
        o.WriteLine($"Effective mass per direction, % of the total in that direction (cumulative); rotations{about}");
        var effective = new TextTable(["mode", .. directions.Select(d => $"{d.Label()} [%]")]);
        foreach (var m in result.Modes)
            effective.Add([m.Number.ToString(Inv), .. directions.Select(d => m.Participation.FirstOrDefault(x => x.Direction == d) is { } x
                ? string.Create(Inv, $"{100 * x.Fraction:F1} ({100 * x.CumulativeFraction:F1})") : "-")]);
        effective.Write(o);
        o.WriteLine(string.Join(", ", result.TotalByDirection.Select(t =>
            t.Direction.IsRotation()
                ? string.Create(Inv, $"total {t.Direction.Label()}: {units.MassUnit.From(t.Value) * length.From(1) * length.From(1):G5} {units.MassUnit.Plain}*{length.Plain}^2")
                : string.Create(Inv, $"total {t.Direction.Label()}: {units.MassUnit.From(t.Value):G5} {units.MassUnit.Plain}"))));
        o.WriteLine();
    }

    /// <summary>The spring with the largest share of the mode's strain energy (the one whose stiffness moves the mode most), with that share.</summary>
    private static string MostStrained(Network network, Mode mode)
    {
        if (mode.IsRigidBody || network.Springs.Length == 0 || !mode.StrainEnergyShare.Any(e => e > 0)) return "-";
        var i = Enumerable.Range(0, network.Springs.Length).MaxBy(k => mode.StrainEnergyShare[k]);
        return string.Create(Inv, $"{network.Springs[i].Name} {100 * mode.StrainEnergyShare[i]:F0}%");
    }

    private static string Dominant(ModalResult result, Mode mode)
    {
        var dofs = result.Matrices.Dofs.Dofs;
        var parts = Enumerable.Range(0, dofs.Length)
            .OrderByDescending(i => mode.KineticEnergyShare[i])
            .Take(3)
            .Where(i => mode.KineticEnergyShare[i] >= 0.05)
            .Select(i => string.Create(Inv, $"{dofs[i]} {100 * mode.KineticEnergyShare[i]:F0}%"));
        return string.Join(", ", parts);
    }
}
