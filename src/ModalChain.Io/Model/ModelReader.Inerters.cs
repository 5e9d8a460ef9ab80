using System.Collections.Immutable;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Yaml;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    private static readonly Range RotationalInertanceRange = new(0, 1e12); // kg·m²/rad, as a body's moment of inertia (0: switched off)

    /// <summary>
    /// Reads 'inerters' of a plane or 3d model in the vocabulary of its springs: <c>inertance: {x: .., z: ..}</c> (kg per
    /// global translation), <c>rotational-inertance: {ry: ..}</c> (kg·m²/rad, body or support ends only) or
    /// <c>axial: ..</c> (kg, along the line between the ends' locations).
    /// </summary>
    private static List<Inerter> ReadSpatialInerters(YMapping top, SpatialNodes nodes, ReadContext context)
    {
        var result = new List<Inerter>();
        if (top["inerters"] is not { } sectionNode || sectionNode is YScalar { IsPlainNull: true }) return result;
        if (context.Mapping(sectionNode, "'inerters'") is not { } mapping) return result;
        const string valueKey = "inertance", rotationKey = "rotational-inertance";
        var space = nodes.Space;
        var example = space == ModelSpace.Plane ? "{x: 150 kg}" : "{x: 150 kg, y: 150 kg}";

        foreach (var (key, value) in mapping.Entries)
        {
            if (!CheckName(key, context, "inerter")) continue;
            var what = $"inerter '{key.Value}'";
            context.Positions[$"inerters.{key.Value}"] = key.Position;
            if (value is not YMapping entry)
            {
                context.Error(value, $"{what} must be a mapping such as '{{between: [deck, ground], {valueKey}: {example}}}'");
                continue;
            }
            context.RejectUnknownKeys(entry, what, "between", valueKey, "axial", rotationKey);
            var ends = ReadSpatialEnds(entry, key.Position, nodes, context, what);

            var components = new List<(DirectionalValue Value, YNode Key)>();
            var ok = true;
            if (entry[valueKey] is { } compNode)
            {
                if (compNode is YScalar)
                {
                    context.Error(compNode, $"'{valueKey}' of {what} is given per direction in a {SpaceName(space)} model, e.g. '{valueKey}: {example}'; or write 'axial: ...' for one acting along the line between its ends");
                    ok = false;
                }
                else ok &= ReadComponents(compNode, $"'{valueKey}' of {what}", Directions.Translations(space), Quantity.Mass, InertanceRange, rotationKey, space, components, context);
            }
            if (entry[rotationKey] is { } rotNode)
                ok &= ReadComponents(rotNode, $"'{rotationKey}' of {what}", Directions.Rotations(space), Quantity.MomentOfInertia, RotationalInertanceRange, valueKey, space, components, context);
            double? axial = null;
            if (entry["axial"] is { } axialNode)
            {
                if (entry[valueKey] is not null || entry[rotationKey] is not null)
                {
                    context.Error(axialNode, $"{what} has 'axial' and per-direction values; give one: 'axial' acts along the line between its ends, '{valueKey}' and '{rotationKey}' act per global direction (declare two inerters for both)");
                    ok = false;
                }
                else axial = context.Value(axialNode, Quantity.Mass, InertanceRange, $"'axial' of {what}");
                ok &= axial is not null;
            }
            else if (entry[valueKey] is null && entry[rotationKey] is null)
            {
                context.Error(key, $"{what} needs '{valueKey}: {example}' (per global direction) or 'axial: ...' (along the line between its ends)");
                ok = false;
            }
            if (ends is not var (a, b) || !ok) continue;

            if (axial is { } axialValue)
            {
                if (CheckAxialEnds(a, b, entry["between"]!, what, context))
                    result.Add(new Inerter(key.Value, a.Reference, b.Reference, axialValue) { Axial = true });
                continue;
            }
            foreach (var (c, cKey) in components)
            {
                if (c.Direction.IsRotation() && (a.Kind is EndKind.Mass or EndKind.Node ? a : b.Kind is EndKind.Mass or EndKind.Node ? b : (End?)null) is { } pointMass)
                {
                    context.Error(cKey, $"{what} has a rotational component '{c.Direction.Label()}', but its end {Describe(pointMass)} is a point mass, which has no rotation; attach it to a body (or a support)");
                    ok = false;
                    continue;
                }
                if (!a.Moves.Contains(c.Direction) && !b.Moves.Contains(c.Direction))
                {
                    context.Error(cKey, $"{what} acts in '{c.Direction.Label()}', but neither {Describe(a)} ({MovesText(a)}) nor {Describe(b)} ({MovesText(b)}) moves in '{c.Direction.Label()}': it would carry no force");
                    ok = false;
                }
            }
            if (!ok) continue;
            var scale = components.Where(c => !c.Value.Direction.IsRotation()).Select(c => c.Value.Value).DefaultIfEmpty(0).Max();
            result.Add(new Inerter(key.Value, a.Reference, b.Reference, scale) { Components = [.. components.Select(c => c.Value).OrderBy(c => c.Direction)] });
        }
        return result;
    }
}
