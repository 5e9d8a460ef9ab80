using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Assembly;

/// <summary>One row of an element in a plane or 3d model: the element stores ½ k (t·u)² and adds k t tᵀ to its matrix.</summary>
/// <param name="Value">Stiffness (N/m, N·m/rad) or damping coefficient (N·s/m, N·m·s/rad) of this row.</param>
/// <param name="Direction">The global direction of a component, or null for an axial element.</param>
/// <param name="Terms">t as (DOF index, coefficient): the relative motion of the two ends in that direction (end A minus end B).</param>
internal sealed record ElementRow(double Value, Direction? Direction, (int Dof, double Coefficient)[] Terms)
{
    /// <summary>t·u for a vector of DOF values (indices beyond u's length are prescribed columns the caller must not pass here).</summary>
    public double Stretch(IReadOnlyList<double> u)
    {
        var s = 0.0;
        foreach (var (i, c) in Terms) s += c * u[i];
        return s;
    }
}

/// <summary>Assembly of plane and 3d networks: masses with several translations, rigid bodies, directional and axial elements.</summary>
/// <remarks>
/// <para>Each element end is an <see cref="AttachmentMap"/> T (6 rows over the DOFs). A spring with components
/// k_d adds K_e = Σ_d k_d (t_A,d − t_B,d)ᵀ (t_A,d − t_B,d), t_·,d the row of direction d. An axial spring of stiffness k
/// between locations x_A and x_B adds K_e = k (nᵀ(T_A − T_B))ᵀ (nᵀ(T_A − T_B)) over the translation rows, with
/// n = (x_B − x_A)/|x_B − x_A|. Dampers build C the same way.</para>
/// <para>M: m on every translation of a point mass; for a body, m on its translations and its inertia matrix J about
/// the centre of mass (global axes) on its rotations (J_yy alone in a plane model). An inerter adds b t tᵀ per row,
/// exactly as a spring adds k t tᵀ to K, so M is full wherever an inerter row joins two DOFs (an axial inerter, two
/// moving ends, a body point off the centre). M is diagonal when every J is and no inerter row couples DOFs.</para>
/// <para>Influence vectors: ι_d for a translation d is a unit rigid translation (1 on every DOF in d); ι_a for a
/// rotation a is a unit rigid rotation about the reference point o: θ = e_a for bodies and u = e_a × (x − o) for
/// masses and body centres. o is the model's centre of mass unless the caller gives one.</para>
/// </remarks>
internal static class SpatialAssembly
{
    /// <summary>The matrices of a plane or 3d <paramref name="network"/> over <paramref name="dofs"/>.</summary>
    public static StructuralMatrices Assemble(Network network, DofMap dofs, Point3? referencePoint)
    {
        CheckNodes(network);
        var n = dofs.Count;
        var resolver = new AttachmentMap.Resolver(network, dofs);

        var (mass, diagonal) = MassEntries(network, dofs);
        foreach (var rows in InerterRows(network, resolver))
        {
            AddRows(mass, rows);
            diagonal &= rows.All(r => r.Terms.Length <= 1);
        }
        var stiffness = new List<(int, int, double)>();
        foreach (var s in network.Springs)
            AddRows(stiffness, RowsOf(network, resolver, s.Name, s.NodeA, s.NodeB, s.Stiffness, s.Components, s.Axial));
        var damping = new List<(int, int, double)>();
        foreach (var d in network.Dampers)
            AddRows(damping, RowsOf(network, resolver, d.Name, d.NodeA, d.NodeB, d.Coefficient, d.Components, d.Axial));

        var o = referencePoint ?? CentreOfMass(network);
        var influences = Influences(network, dofs, o);
        return new StructuralMatrices(dofs, Assembler.Summed(n, mass), Assembler.Summed(n, stiffness), Assembler.Summed(n, damping),
            influences.First(i => i.Direction == Direction.Z).Vector, diagonal)
        {
            Influences = influences,
            ReferencePoint = o,
        };
    }

    /// <summary>The free/prescribed partition of a plane or 3d network: one prescribed column per support and translation.</summary>
    public static SupportPartition Partition(Network network)
    {
        CheckNodes(network);
        var free = DofMap.For(network);
        var n = free.Count;
        var translations = Directions.Translations(network.Space);
        var labels = network.Supports.SelectMany(s => translations.Select(d => $"{s.Name}.{d.Label()}")).ToImmutableArray();
        var column = new Dictionary<(string, Direction), int>();
        foreach (var (s, i) in network.Supports.Select((s, i) => (s, i)))
            foreach (var (d, j) in translations.Select((d, j) => (d, j)))
                column[(s.Name, d)] = n + i * translations.Length + j;
        var resolver = new AttachmentMap.Resolver(network, free, (s, d) => column.GetValueOrDefault((s, d), -1));
        var total = n + labels.Length;

        var k = new List<(int, int, double)>();
        foreach (var s in network.Springs)
            AddRows(k, RowsOf(network, resolver, s.Name, s.NodeA, s.NodeB, s.Stiffness, s.Components, s.Axial));
        var c = new List<(int, int, double)>();
        foreach (var d in network.Dampers)
            AddRows(c, RowsOf(network, resolver, d.Name, d.NodeA, d.NodeB, d.Coefficient, d.Components, d.Axial));
        var kk = Matrix<double>.Build.DenseOfMatrix(Assembler.Summed(total, k));
        var cc = Matrix<double>.Build.DenseOfMatrix(Assembler.Summed(total, c));
        // Inerter rows reach the prescribed columns as spring rows do: M over the whole numbering, then split.
        var mEntries = MassEntries(network, free).Entries;
        foreach (var rows in InerterRows(network, resolver)) AddRows(mEntries, rows);
        var mm = Matrix<double>.Build.DenseOfMatrix(Assembler.Summed(total, mEntries));
        var p = labels.Length;
        return new SupportPartition(free, labels, mm.SubMatrix(0, n, 0, n),
            kk.SubMatrix(0, n, 0, n), kk.SubMatrix(0, n, n, p), kk.SubMatrix(n, p, n, p),
            cc.SubMatrix(0, n, 0, n), cc.SubMatrix(0, n, n, p), cc.SubMatrix(n, p, n, p))
        {
            MassFP = mm.SubMatrix(0, n, n, p),
            MassPP = mm.SubMatrix(n, p, n, p),
        };
    }

    /// <summary>
    /// The rows of every inerter, in declaration order: b t tᵀ adds to M as k t tᵀ adds to K (b in kg for a
    /// translation or an axial row, kg·m²/rad for a rotation).
    /// </summary>
    private static IEnumerable<ImmutableArray<ElementRow>> InerterRows(Network network, AttachmentMap.Resolver resolver) =>
        network.Inerters.Select(i => RowsOf(network, resolver, i.Name, i.NodeA, i.NodeB, i.Inertance, i.Components, i.Axial));

    /// <summary>The rows of every spring of <paramref name="network"/>, in declaration order, over the free DOFs.</summary>
    public static ImmutableArray<ImmutableArray<ElementRow>> SpringRows(Network network, DofMap dofs)
    {
        var resolver = new AttachmentMap.Resolver(network, dofs);
        return [.. network.Springs.Select(s => RowsOf(network, resolver, s.Name, s.NodeA, s.NodeB, s.Stiffness, s.Components, s.Axial))];
    }

    /// <summary>The centre of mass of every mass and body, in m.</summary>
    public static Point3 CentreOfMass(Network network)
    {
        double m = 0, x = 0, y = 0, z = 0;
        void Add(double kg, Point3 at)
        {
            m += kg;
            x += kg * at.X;
            y += kg * at.Y;
            z += kg * at.Z;
        }
        foreach (var mass in network.Masses) Add(mass.Kilograms, mass.Location ?? throw NoLocation(mass));
        foreach (var body in network.Bodies) Add(body.Kilograms, body.CentreOfMass);
        return m > 0 ? new Point3(x / m, y / m, z / m) : default;
    }

    /// <summary>The rows of one element: a component per direction, or one axial row.</summary>
    /// <exception cref="ArgumentException">A direction outside the space, a rotation at a point-mass end, both ends on one body, an axial element without locations or of zero length, or an element with neither components nor axial value.</exception>
    public static ImmutableArray<ElementRow> RowsOf(Network network, AttachmentMap.Resolver resolver, string name, string nodeA, string nodeB,
        double value, ImmutableArray<DirectionalValue> components, bool axial)
    {
        var a = resolver.Of(nodeA);
        var b = resolver.Of(nodeB);
        if (a.Kind == AttachmentKind.BodyPoint && b.Kind == AttachmentKind.BodyPoint && a.Node == b.Node)
            throw new ArgumentException($"'{name}' joins two points of rigid body '{a.Node}', which cannot move relative to each other.", nameof(nodeB));
        var space = Directions.All(network.Space);
        if (axial)
        {
            var from = a.Location ?? throw new ArgumentException($"Axial element '{name}': end '{nodeA}' has no location.", nameof(nodeA));
            var to = b.Location ?? throw new ArgumentException($"Axial element '{name}': end '{nodeB}' has no location.", nameof(nodeB));
            var line = to - from;
            var length = line.Length;
            if (!(length > 0)) throw new ArgumentException($"Axial element '{name}' has zero length: both ends are at the same location.", nameof(nodeB));
            var terms = new Dictionary<int, double>();
            foreach (var d in Directions.Translations(network.Space))
            {
                var nd = Component(line, d) / length;
                if (nd == 0) continue;
                Accumulate(terms, a.Row(d), nd);
                Accumulate(terms, b.Row(d), -nd);
            }
            return value == 0 ? [] : [new ElementRow(value, null, Compact(terms))];
        }
        if (components.IsDefaultOrEmpty)
        {
            if (value == 0) return [];
            throw new ArgumentException($"Element '{name}' in a plane or 3d model needs directional components or an axial value.", nameof(components));
        }
        var rows = ImmutableArray.CreateBuilder<ElementRow>(components.Length);
        foreach (var (d, k) in components)
        {
            if (!space.Contains(d))
                throw new ArgumentException($"Element '{name}' acts in '{d}', which is not a direction of the model's space.", nameof(components));
            if (d.IsRotation())
                foreach (var end in new[] { a, b })
                    if (end.Kind == AttachmentKind.PointMass)
                        throw new ArgumentException($"Element '{name}' has a rotational component '{d.Label()}' but its end '{end.Reference}' is a point mass, which has no rotation (use a rigid body).", nameof(components));
            var terms = new Dictionary<int, double>();
            Accumulate(terms, a.Row(d), 1);
            Accumulate(terms, b.Row(d), -1);
            if (k != 0) rows.Add(new ElementRow(k, d, Compact(terms)));
        }
        return rows.ToImmutable();
    }

    /// <summary>k t tᵀ of every row as coordinate entries (each product formed once, so the result is exactly symmetric).</summary>
    private static void AddRows(List<(int, int, double)> entries, ImmutableArray<ElementRow> rows)
    {
        foreach (var row in rows)
        {
            var t = row.Terms;
            for (var p = 0; p < t.Length; p++)
                for (var q = p; q < t.Length; q++)
                {
                    var v = row.Value * t[p].Coefficient * t[q].Coefficient;
                    entries.Add((t[p].Dof, t[q].Dof, v));
                    if (t[p].Dof != t[q].Dof) entries.Add((t[q].Dof, t[p].Dof, v));
                }
        }
    }

    private static (List<(int Row, int Column, double Value)> Entries, bool Diagonal) MassEntries(Network network, DofMap dofs)
    {
        var entries = new List<(int, int, double)>(dofs.Count);
        foreach (var m in network.Masses)
            foreach (var d in Directions.Translations(network.Space))
                if (dofs.IndexOf(m.Name, d) is var i and >= 0) entries.Add((i, i, m.Kilograms));
        var diagonal = true;
        var rotations = Directions.Rotations(network.Space);
        foreach (var body in network.Bodies)
        {
            CheckInertia(body, network.Space);
            foreach (var d in Directions.Translations(network.Space)) entries.Add((dofs.IndexOf(body.Name, d), dofs.IndexOf(body.Name, d), body.Kilograms));
            var j = body.Inertia.ToArray();
            foreach (var r in rotations)
                foreach (var c in rotations)
                {
                    var v = j[AxisIndex(r), AxisIndex(c)];
                    if (v == 0) continue;
                    if (r != c) diagonal = false;
                    entries.Add((dofs.IndexOf(body.Name, r), dofs.IndexOf(body.Name, c), v));
                }
        }
        return (entries, diagonal);
    }

    /// <summary>ι per direction of the space (translations, then rotations about <paramref name="o"/>).</summary>
    private static ImmutableArray<DirectionalInfluence> Influences(Network network, DofMap dofs, Point3 o)
    {
        var result = ImmutableArray.CreateBuilder<DirectionalInfluence>();
        foreach (var d in Directions.All(network.Space))
        {
            var v = Vector<double>.Build.Dense(dofs.Count);
            void Translate(string node, Point3 at)
            {
                // Unit translation along d, or unit rotation about d's axis through o: u = e × (x − o).
                var u = d.IsRotation() ? Cross(d.Axis(), at - o) : d.Axis();
                foreach (var t in Directions.Translations(network.Space))
                    if (dofs.IndexOf(node, t) is var i and >= 0) v[i] = Component(u, t);
            }
            foreach (var m in network.Masses) Translate(m.Name, m.Location ?? throw NoLocation(m));
            foreach (var body in network.Bodies)
            {
                Translate(body.Name, body.CentreOfMass);
                if (d.IsRotation()) v[dofs.IndexOf(body.Name, d)] = 1;
            }
            result.Add(new DirectionalInfluence(d, v));
        }
        return result.ToImmutable();
    }

    /// <summary>Every mass of a plane or 3d model has a location; every body's inertia is positive definite.</summary>
    private static void CheckNodes(Network network)
    {
        foreach (var m in network.Masses)
            if (m.Location is null) throw NoLocation(m);
        foreach (var b in network.Bodies) CheckInertia(b, network.Space);
    }

    /// <summary>J (its rotations in the space) must be symmetric positive definite: Cholesky's leading minors.</summary>
    private static void CheckInertia(RigidBody body, ModelSpace space)
    {
        var j = body.Inertia;
        bool ok;
        if (space == ModelSpace.Plane) ok = j.Yy > 0 && double.IsFinite(j.Yy);
        else
        {
            var a = j.ToArray();
            var minor1 = a[0, 0];
            var minor2 = a[0, 0] * a[1, 1] - a[0, 1] * a[1, 0];
            var det = a[0, 0] * (a[1, 1] * a[2, 2] - a[1, 2] * a[2, 1]) - a[0, 1] * (a[1, 0] * a[2, 2] - a[1, 2] * a[2, 0])
                + a[0, 2] * (a[1, 0] * a[2, 1] - a[1, 1] * a[2, 0]);
            ok = new[] { j.Xx, j.Yy, j.Zz, j.Xy, j.Yz, j.Xz }.All(double.IsFinite) && minor1 > 0 && minor2 > 0 && det > 0;
        }
        if (!ok) throw new ArgumentException($"Rigid body '{body.Name}' has an inertia matrix that is not positive definite.", nameof(body));
    }

    private static ArgumentException NoLocation(Mass m) =>
        new($"Mass '{m.Name}' has no location; every mass of a plane or 3d model needs one.", nameof(m));

    private static int AxisIndex(Direction rotation) => rotation switch
    {
        Direction.Rx => 0,
        Direction.Ry => 1,
        _ => 2,
    };

    internal static double Component(Point3 v, Direction translation) => translation switch
    {
        Direction.X => v.X,
        Direction.Y => v.Y,
        Direction.Z => v.Z,
        _ => throw new ArgumentOutOfRangeException(nameof(translation)),
    };

    internal static Point3 Cross(Point3 a, Point3 b) => new(a.Y * b.Z - a.Z * b.Y, a.Z * b.X - a.X * b.Z, a.X * b.Y - a.Y * b.X);

    private static void Accumulate(Dictionary<int, double> terms, IReadOnlyList<(int Dof, double Coefficient)> row, double factor)
    {
        foreach (var (i, c) in row) terms[i] = terms.GetValueOrDefault(i) + factor * c;
    }

    private static (int, double)[] Compact(Dictionary<int, double> terms) =>
        [.. terms.Where(t => t.Value != 0).OrderBy(t => t.Key).Select(t => (t.Key, t.Value))];
}
