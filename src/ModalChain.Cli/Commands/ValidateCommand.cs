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
                o.WriteLine(string.Create(inv, $"  degrees of freedom:  {Core.Dofs.DofMap.ForScalarNetwork(n).Count} (one direction per mass{(n.Links.IsEmpty ? "" : "; linked masses share one")})"));
            else
                o.WriteLine(string.Create(inv, $"  degrees of freedom:  {Core.Dofs.DofMap.For(n).Count} ({(n.Space == Core.Model.ModelSpace.Plane ? "plane" : "3d")} model: the translations of each mass, every direction of each rigid body)"));
            var mass = CommonOptions.UnitsOf(parse, units, document).MassUnit;
            o.WriteLine(string.Create(inv, $"  total mass:          {mass.From(n.TotalMass):G6} {mass.Plain}"));
            o.WriteLine(string.Create(inv, $"  springs, dampers:    {n.Springs.Length}, {n.Dampers.Length}"));
            if (n.Inerters.Length > 0) o.WriteLine(string.Create(inv, $"  inerters:            {n.Inerters.Length}"));
            var groups = Topology.UnsupportedGroups(n);
            o.WriteLine(string.Create(inv, $"  unsupported groups:  {groups.Length}{(groups.Length > 0 ? " (rigid-body modes expected)" : "")}"));
            o.WriteLine(string.Create(inv, $"  warnings:            {CommonOptions.WarningCount(document)}"));
            o.WriteLine($"  sha256:              {document.Sha256}");
            return ExitCodes.Success;
        });
        return command;
    }
}
