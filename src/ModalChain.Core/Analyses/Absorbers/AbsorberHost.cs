using System.Collections.Immutable;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Absorbers;

/// <summary>Where an absorber acts: a point of the model and the line along which its mass moves.</summary>
/// <remarks>
/// In a line model the host is a mass and the absorber moves along the model's one line. In plane and 3d models a tuned
/// mass acts along one line, so the host names a point and a translation: a DOF label of a mass or body
/// (<c>deck.z</c>, <c>skid.x</c>, the body's centre of mass), a mass with a single DOF by its bare name (its label), or a
/// point of a body with a direction (<c>skid.top.x</c>). The host's motion is the attachment row a of that point and
/// direction (<see cref="AttachmentMap"/>): x_h = a·u, so with mass-normalised φ the mode seen there has modal mass
/// 1/(a·φ)².
/// </remarks>
/// <param name="Label">The host as given: a mass name (line models), a DOF label or <c>body.point.direction</c>.</param>
/// <param name="Reference">What the absorber's spring and damper attach to: a mass, a body (its centre of mass) or <c>body.point</c>.</param>
/// <param name="Direction"><see cref="Direction.Along"/> in line models; the translation x, y or z the absorber acts along otherwise.</param>
/// <param name="Location">The point's location in m in plane and 3d models; null in line models.</param>
public sealed record AbsorberHost(string Label, string Reference, Direction Direction, Point3? Location)
{
    /// <summary>The host <paramref name="label"/> names in <paramref name="network"/>, or null with the reason in <paramref name="problem"/>.</summary>
    public static AbsorberHost? Resolve(Network network, string label, out string? problem)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(label);
        problem = null;
        if (network.Space == ModelSpace.Line)
        {
            if (network.IsMass(label)) return new AbsorberHost(label, label, Direction.Along, null);
            problem = network.IsSupport(label)
                ? $"host '{label}' is a support; an absorber must hang on a mass"
                : $"host '{label}' is not a mass of the model; masses: {string.Join(", ", network.Masses.Select(m => m.Name))}";
            return null;
        }
        var dofs = DofMap.For(network);
        var space = network.Space == ModelSpace.Plane ? "plane" : "3d";
        var translations = Directions.Translations(network.Space);
        string Choices() => Listing(network, dofs);
        if (dofs.IndexOfLabel(label) is var index and >= 0)
        {
            var dof = dofs.Dofs[index];
            if (dof.Direction.IsRotation())
            {
                problem = $"host '{label}' is a rotation; a tuned mass acts along a line: give a point and a translation; hosts: {Choices()}";
                return null;
            }
            return Located(network, label, dof.Node, dof.Direction);
        }
        if (network.Resolve(label) is { } whole)
        {
            problem = network.IsSupport(whole.Node)
                ? $"host '{label}' is a support; an absorber must hang on a mass or a body"
                : $"host '{label}' needs the direction the absorber acts along in a {space} model; hosts: {Choices()}";
            return null;
        }
        var dot = label.LastIndexOf('.');
        var direction = dot > 0 ? Directions.Parse(label[(dot + 1)..]) : null;
        var reference = dot > 0 ? label[..dot] : label;
        if (direction is null || network.Resolve(reference) is not { } attachment)
        {
            problem = $"host '{label}' is not a DOF label or a body point with a direction in this {space} model; hosts: {Choices()}";
            return null;
        }
        if (network.IsSupport(attachment.Node))
        {
            problem = $"host '{label}' is on a support; an absorber must hang on a mass or a body";
            return null;
        }
        if (direction.Value.IsRotation())
        {
            problem = $"host '{label}' is a rotation; a tuned mass acts along a line: give a point and a translation ({string.Join(", ", translations.Select(d => d.Label()))}); hosts: {Choices()}";
            return null;
        }
        if (!translations.Contains(direction.Value))
        {
            problem = $"host '{label}': '{direction.Value.Label()}' is not a direction of a {space} model ({string.Join(", ", translations.Select(d => d.Label()))})";
            return null;
        }
        if (network.IsMass(reference) && dofs.IndexOf(reference, direction.Value) < 0)
        {
            problem = $"host '{label}': mass '{reference}' does not move in {direction.Value.Label()}; its DOFs: {string.Join(", ", dofs.OutputLabels(reference))}";
            return null;
        }
        return Located(network, label, reference, direction.Value);
    }

    private static AbsorberHost Located(Network network, string label, string reference, Direction direction)
    {
        var at = network.Resolve(reference)!;
        var location = network.Masses.FirstOrDefault(m => m.Name == reference)?.Location ?? at.Location;
        return new AbsorberHost(label, reference, direction, location);
    }

    /// <summary>The hosts of a plane or 3d network, for messages: the translation DOF labels of masses and bodies, and the form for a body point.</summary>
    private static string Listing(Network network, DofMap dofs)
    {
        const int shown = 12;
        var labels = Enumerable.Range(0, dofs.Count).Where(i => !dofs.Dofs[i].Direction.IsRotation()).Select(dofs.Label).ToList();
        var text = string.Join(", ", labels.Take(shown)) + (labels.Count > shown ? $" and {labels.Count - shown} more" : "");
        var point = network.Bodies.FirstOrDefault(b => !b.Points.IsDefaultOrEmpty);
        return point is null ? text : $"{text}, or a body point with a direction such as '{point.Name}.{point.Points[0].Name}.{Directions.Translations(network.Space)[^1].Label()}'";
    }

    /// <summary>The host's motion as Σ coefficient·u[DOF] over <paramref name="dofs"/>, the DOFs of <paramref name="network"/>.</summary>
    internal ImmutableArray<(int Dof, double Coefficient)> Row(Network network, DofMap dofs)
    {
        if (Direction == Direction.Along)
            return dofs.IndexOf(Reference) is var i and >= 0 ? [(i, 1.0)] : [];
        return [.. new AttachmentMap.Resolver(network, dofs).Of(Reference).Row(Direction)];
    }

    /// <summary>The host's motion as a dense row over <paramref name="dofs"/>.</summary>
    internal double[] Observation(Network network, DofMap dofs)
    {
        var row = new double[dofs.Count];
        foreach (var (i, c) in Row(network, dofs)) row[i] += c;
        return row;
    }

    /// <summary>The host's displacement a·φ in a shape over the DOFs of <paramref name="dofs"/>.</summary>
    internal double Motion(Network network, DofMap dofs, IReadOnlyList<double> shape) => Row(network, dofs).Sum(t => t.Coefficient * shape[t.Dof]);

    /// <summary>A unit harmonic force at the host, along its direction.</summary>
    public ForceLoad UnitForce() => new("unit force at the host", Reference, 1, 0) { Direction = Direction };
}
