using System.CommandLine;
using System.Globalization;
using ModalChain.Core.Model;
using ModalChain.Io.Text;

namespace ModalChain.Cli.Commands;

/// <summary><c>modalchain validate FILE</c>: reads and checks a model, then prints a short summary.</summary>
internal static class ValidateCommand
{
    public static Command Create(Streams io)
    {
        var file = CommonOptions.ModelFile();
        var units = CommonOptions.Units();
        var command = new Command("validate",
            "Check a model file and summarise it (degrees of freedom, total mass, warnings). " +
            "Every problem is reported as FILE:LINE:COL. Exit code 2 when the file has errors.")
        { file, units };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var document = CommonOptions.Load(path, io);
            if (document is null) return ExitCodes.InputError;
            if (document.Circuit is { } circuit) return CircuitCommands.Validate(io, path, document, circuit);
            var n = document.Network;
            var inv = CultureInfo.InvariantCulture;
            var o = io.Output;
            o.WriteLine($"{path}: valid");
            o.WriteLine($"  title:               {TerminalText.Line(n.Title)}");
            if (n.Space == Core.Model.ModelSpace.Line)
            {
                var dofs = Core.Dofs.DofMap.ForScalarNetwork(n);
                var electrical = dofs.Dofs.Count(d => n.IsElectrical(d.Node));
                o.WriteLine(string.Create(inv, $"  degrees of freedom:  {dofs.Count} (one direction per mass{(n.Links.IsEmpty ? "" : "; linked masses share one")}{(electrical > 0 ? $"; {electrical} of them circuit nodes' flux linkages" : "")})"));
            }
            else
                o.WriteLine(string.Create(inv, $"  degrees of freedom:  {Core.Dofs.DofMap.For(n).Count} ({(n.Space == Core.Model.ModelSpace.Plane ? "plane" : "3d")} model: the translations of each mass, every direction of each rigid body)"));
            var mass = CommonOptions.UnitsOf(parse, units, document).MassUnit;
            o.WriteLine(string.Create(inv, $"  total mass:          {mass.From(n.TotalMass):G6} {mass.Plain}"));
            // The electrical side (a circuit's analogue, a transducer's branch) is counted apart, as the report's summary
            // counts it (ModelCounts): its dampers are resistors, its springs inductors, its inerters capacitors; a group
            // of its nodes no inductor holds is a flux level, not a rigid-body mode, so only Topology.RigidBodyGroups count.
            var counts = Reports.Sections.ModelCounts.Of(n);
            o.WriteLine(string.Create(inv, $"  springs, dampers:    {counts.Springs}, {counts.Dampers}"));
            if (counts.Inerters > 0) o.WriteLine(string.Create(inv, $"  inerters:            {counts.Inerters}"));
            if (!n.ElectricalNodes.IsEmpty)
            {
                o.WriteLine(string.Create(inv, $"  electrical side:     {n.ElectricalNodes.Length} nodes, {counts.Resistors} resistors, {counts.Inductors} inductors, {counts.Capacitors} capacitors between nodes"));
                o.WriteLine(string.Create(inv, $"  transducers:         {counts.Transducers}"));
            }
            var groups = Topology.RigidBodyGroups(n);
            o.WriteLine(string.Create(inv, $"  unsupported groups:  {groups.Length}{(groups.Length > 0 ? " (rigid-body modes expected)" : "")}"));
            o.WriteLine(string.Create(inv, $"  warnings:            {CommonOptions.WarningCount(document)}"));
            o.WriteLine($"  sha256:              {document.Sha256}");
            return ExitCodes.Success;
        });
        return command;
    }
}
