using System.Collections.Immutable;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Assembly;

/// <summary>One direction of one spring or damper of a plane or 3d model, as the analyses report its force.</summary>
/// <param name="Element">The spring's or damper's name.</param>
/// <param name="IsDamper">True for a damper (force iωc·Δ), false for a spring (force k(1 + iη)·Δ).</param>
/// <param name="Label">The global direction's label (<c>x</c> … <c>rz</c>) of a component, or <c>axial</c> for the force along the element's line.</param>
/// <param name="Value">k_d or c_d of this row (N/m, N·m/rad, N·s/m, N·m·s/rad), or k, c of an axial element.</param>
/// <param name="Free">Δ over the free DOFs: (index, coefficient).</param>
/// <param name="Prescribed">Δ over the partition's prescribed columns (support, translation): (column, coefficient).</param>
/// <param name="Axis">For an axial element the unit vector n from end A to end B, to resolve the force into x, y, z; null for a component.</param>
internal sealed record MountRow(string Element, bool IsDamper, string Label, double Value, (int Index, double Coefficient)[] Free,
    (int Column, double Coefficient)[] Prescribed, Point3? Axis)
{
    /// <summary>True for a rotational component: a moment in N·m.</summary>
    public bool IsMoment => Label is "rx" or "ry" or "rz";
}

/// <summary>Loads and element forces of plane and 3d models through the attachment maps.</summary>
/// <remarks>
/// <para>A load F in global direction d at an attachment with map T (its six rows over the DOFs) does the virtual
/// work F·t_d·δq, so it enters the equations of motion as the generalised force f_q = Tᵀ e_d F: on a point mass it
/// lands on its translation d; at a point p of a rigid body with centre c it gives the force on the centre and the
/// moment (p − c) × F; a rotation d is a moment on the body (N·m).</para>
/// <para>The relative motion of an element's ends in one row is Δ = (t_A − t_B)·[x; u], x the free DOFs and u the
/// prescribed support translations; the element applies k·Δ (spring) or iωc·Δ (damper) to its second end B in that
/// direction, and the opposite to end A. An axial element's force acts along n = (x_B − x_A)/|x_B − x_A|.</para>
/// </remarks>
internal static class SpatialLoads
{
    /// <summary>Tᵀ e_d over the free DOFs: the generalised force of a unit force (or, for a rotation, a unit moment) at <paramref name="at"/>.</summary>
    /// <exception cref="ArgumentException">
    /// A direction outside the model's space, a reference that names nothing or a support, a moment on a point mass, or
    /// a direction the point does not move in.
    /// </exception>
    public static (int Dof, double Weight)[] UnitLoad(Network network, DofMap dofs, string at, Direction direction, string load)
    {
        if (!Directions.All(network.Space).Contains(direction))
            throw new ArgumentException(direction == Direction.Along
                ? $"Load '{load}' needs a direction (x, y, z or a rotation) in a {SpaceName(network.Space)} model."
                : $"Load '{load}' acts in '{direction.Label()}', which is not a direction of a {SpaceName(network.Space)} model.", nameof(direction));
        if (network.Resolve(at) is null)
            throw new ArgumentException($"Load '{load}' acts at '{at}', which is not a mass, body or body point of the network.", nameof(at));
        var map = new AttachmentMap.Resolver(network, dofs).Of(at);
        if (map.Kind == AttachmentKind.Support)
            throw new ArgumentException($"Load '{load}' acts at support '{at}'; a load acts on a mass or a body.", nameof(at));
        if (direction.IsRotation() && map.Kind == AttachmentKind.PointMass)
            throw new ArgumentException($"Load '{load}' is a moment about {direction.Label()} at point mass '{at}', which has no rotation (use a rigid body).", nameof(direction));
        var row = map.Row(direction);
        if (row.Count == 0)
            throw new ArgumentException($"Load '{load}' acts in '{direction.Label()}' at '{at}', which does not move in that direction.", nameof(direction));
        return [.. row];
    }

    /// <summary>The prescribed column of <paramref name="support"/> moving in <paramref name="direction"/>, or −1 when the partition has none.</summary>
    /// <exception cref="ArgumentException">A line model with a direction, a plane or 3d model without one, or a rotation.</exception>
    public static int SupportColumn(SupportPartition partition, ModelSpace space, string support, Direction direction, string load)
    {
        if (space == ModelSpace.Line)
        {
            if (direction != Direction.Along)
                throw new ArgumentException($"Load '{load}' moves '{support}' in '{direction.Label()}', but a line model moves along its one line only.", nameof(direction));
            return partition.SupportIndex(support);
        }
        if (!Directions.Translations(space).Contains(direction))
            throw new ArgumentException(direction == Direction.Along
                ? $"Load '{load}' needs the direction the support moves in (a translation) in a {SpaceName(space)} model."
                : $"Load '{load}' moves '{support}' in '{direction.Label()}'; a support moves in a translation of the model's space ({string.Join(", ", Directions.Translations(space).Select(d => d.Label()))}).",
                nameof(direction));
        return partition.SupportIndex($"{support}.{direction.Label()}");
    }

    /// <summary>
    /// The rows of every spring, then every damper of a plane or 3d network, in declaration order, over the free DOFs
    /// of <paramref name="partition"/> and its prescribed columns (support, translation).
    /// </summary>
    public static ImmutableArray<MountRow> MountRows(Network network, SupportPartition partition) =>
        MountRows(network, partition.Free, partition.Supports);

    /// <summary>The rows of every spring, then every damper, over <paramref name="free"/> and the prescribed columns labelled <c>support.x</c> … in <paramref name="supportColumns"/>.</summary>
    public static ImmutableArray<MountRow> MountRows(Network network, DofMap free, IReadOnlyList<string> supportColumns)
    {
        var n = free.Count;
        var columns = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var c = 0; c < supportColumns.Count; c++) columns.TryAdd(supportColumns[c], c);
        var resolver = new AttachmentMap.Resolver(network, free, (s, d) =>
            columns.TryGetValue($"{s}.{d.Label()}", out var c) ? n + c : -1);
        var rows = ImmutableArray.CreateBuilder<MountRow>();
        void Add(string name, string a, string b, double value, ImmutableArray<DirectionalValue> components, bool axial, bool damper)
        {
            Point3? axis = null;
            if (axial)
            {
                var from = resolver.Of(a).Location;
                var to = resolver.Of(b).Location;
                if (from is { } p && to is { } q && (q - p).Length is var length and > 0)
                    axis = new Point3((q.X - p.X) / length, (q.Y - p.Y) / length, (q.Z - p.Z) / length);
            }
            foreach (var row in SpatialAssembly.RowsOf(network, resolver, name, a, b, value, components, axial))
                rows.Add(new MountRow(name, damper, row.Direction is { } d ? d.Label() : "axial", row.Value,
                    [.. row.Terms.Where(t => t.Dof < n)], [.. row.Terms.Where(t => t.Dof >= n).Select(t => (t.Dof - n, t.Coefficient))], axis));
        }
        foreach (var s in network.Springs) Add(s.Name, s.NodeA, s.NodeB, s.Stiffness, s.Components, s.Axial, damper: false);
        foreach (var d in network.Dampers) Add(d.Name, d.NodeA, d.NodeB, d.Coefficient, d.Components, d.Axial, damper: true);
        return rows.ToImmutable();
    }

    /// <summary>The labels a row's force is reported under: its own, and for an axial row its x, y, z resolution (non-zero components of n).</summary>
    public static IEnumerable<(string Label, double Factor)> Resolved(MountRow row, ModelSpace space)
    {
        yield return (row.Label, 1.0);
        if (row.Axis is not { } n) yield break;
        foreach (var d in Directions.Translations(space))
            if (SpatialAssembly.Component(n, d) is var f && f != 0) yield return (d.Label(), f);
    }

    private static string SpaceName(ModelSpace space) => space switch
    {
        ModelSpace.Plane => "plane",
        ModelSpace.ThreeD => "3d",
        _ => "line",
    };
}
