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
    private static List<Inerter> ReadSpatialInerters(YMapping top, SpatialNodes nodes, ReadContext context) =>
        [.. ReadSpatialElements(top, InerterKind, nodes, context).Select(e => e.Axial
            ? new Inerter(e.Name, e.A, e.B, e.Scale) { Axial = true }
            : new Inerter(e.Name, e.A, e.B, e.Scale) { Components = e.Components })];

    private static SpatialElementKind InerterKind => new("inerters", "inerter", "inertance", "rotational-inertance",
        Quantity.Mass, InertanceRange, Quantity.MomentOfInertia, RotationalInertanceRange,
        "{x: 150 kg}", "{x: 150 kg, y: 150 kg}", "deck, ground");
}
