using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Yaml;
using CoreNetwork = ModalChain.Core.Model.Network;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    private static readonly Range LocationRange = new(-1e5, 1e5);                                // m
    private static readonly Range RotationalStiffnessRange = new(0, 1e14);                       // N·m/rad
    private static readonly Range RotationalDampingRange = new(0, 1e13);                         // N·m·s/rad
    private static readonly Range MomentRange = new(0, 1e10);                                    // N·m

    private static readonly string[] SpaceWords = ["line", "plane", "3d"];

    /// <summary>What the reader knows about the nodes of a plane or 3d model, kept even where an entry had errors so references to it add no second error.</summary>
    private sealed class SpatialNodes(ModelSpace space)
    {
        public ModelSpace Space { get; } = space;
        public Dictionary<string, (Point3? Location, ImmutableArray<Direction> Moves)> Masses { get; } = new(StringComparer.Ordinal);
        public Dictionary<string, (Point3? Location, ImmutableArray<Direction> Moves)> Nodes { get; } = new(StringComparer.Ordinal);
        public Dictionary<string, Point3?> Supports { get; } = new(StringComparer.Ordinal) { [CoreNetwork.Ground] = null };
        public Dictionary<string, Dictionary<string, Point3?>> Bodies { get; } = new(StringComparer.Ordinal);
        public Dictionary<string, Point3?> CentresOfMass { get; } = new(StringComparer.Ordinal);

        public IEnumerable<string> Names => Masses.Keys.Concat(Nodes.Keys).Concat(Supports.Keys).Concat(Bodies.Keys);
    }

    /// <summary>What an element end is; a massless <see cref="Node"/> is a point like a mass (translations only) that takes no load.</summary>
    private enum EndKind { Mass, Support, Body, Node }

    /// <summary>A resolved element end or load target: the node, what kind it is, where it is and the directions it moves in.</summary>
    private readonly record struct End(string Reference, string Node, EndKind Kind, Point3? Location, ImmutableArray<Direction> Moves);

    /// <summary>Reads 'space': line (the default), plane or 3d; null after an error.</summary>
    private static ModelSpace? ReadSpace(YMapping top, ReadContext context)
    {
        if (top["space"] is not { } node) return ModelSpace.Line;
        if (context.Text(node, "'space'") is not { } text) return null;
        switch (text)
        {
            case "line": return ModelSpace.Line;
            case "plane": return ModelSpace.Plane;
            case "3d": return ModelSpace.ThreeD;
            default:
                context.Error(node, $"'space' is '{text}'{ReadContext.Suggest(text, SpaceWords)}; write 'line' (one direction of motion, the default), 'plane' (x, z and rotation ry) or '3d'");
                return null;
        }
    }

    private static string SpaceName(ModelSpace space) => space == ModelSpace.Plane ? "plane" : "3d";

    private static string LocationForm(ModelSpace space) => space == ModelSpace.Plane ? "[x, z]" : "[x, y, z]";

    private static string DirectionList(IEnumerable<Direction> directions) => string.Join(", ", directions.Select(d => d.Label()));

    /// <summary>Reports <paramref name="key"/> of <paramref name="mapping"/> when present in a line model, where it has no meaning.</summary>
    private static void RefuseInLine(YMapping mapping, string key, string what, ReadContext context)
    {
        foreach (var (k, _) in mapping.Entries)
            if (k.Value == key)
                context.Error(k, $"'{key}' of {what} needs 'space: plane' or 'space: 3d' at the top of the file; a line model moves every mass along one line");
    }

    /// <summary>A location: [x, z] in a plane model (y = 0), [x, y, z] in a 3d model; metres, z up.</summary>
    private static Point3? ReadLocation(YNode node, ModelSpace space, ReadContext context, string what)
    {
        var count = space == ModelSpace.Plane ? 2 : 3;
        if (node is not YSequence seq || seq.Items.Length != count)
        {
            var hint = space == ModelSpace.Plane ? "a plane model is a side view: x horizontal, z up" : "x and y horizontal, z up";
            context.Error(node, $"{what} must be a location {LocationForm(space)} in m ({hint})");
            return null;
        }
        var v = seq.Items.Select(i => context.Value(i, Quantity.Length, LocationRange, what)).ToArray();
        if (v.Any(x => x is null)) return null;
        return space == ModelSpace.Plane ? new Point3(v[0]!.Value, 0, v[1]!.Value) : new Point3(v[0]!.Value, v[1]!.Value, v[2]!.Value);
    }

    /// <summary>One direction word of the model's space; <paramref name="allowed"/> narrows it (translations only, say).</summary>
    private static Direction? ReadDirectionWord(YNode node, ModelSpace space, ReadContext context, string what, ImmutableArray<Direction> allowed)
    {
        if (context.Text(node, what) is not { } text) return null;
        var all = Directions.All(space);
        if (Directions.Parse(text) is not { } d)
        {
            context.Error(node, $"{what} is '{text}'{ReadContext.Suggest(text, allowed.Select(a => a.Label()))}; write one of {DirectionList(allowed)}");
            return null;
        }
        if (!all.Contains(d))
        {
            context.Error(node, $"{what} is '{text}', which a {SpaceName(space)} model does not have: its directions are {DirectionList(all)}");
            return null;
        }
        if (!allowed.Contains(d))
        {
            context.Error(node, $"{what} is '{text}', but only {DirectionList(allowed)} may be given here");
            return null;
        }
        return d;
    }

    /// <summary>A mass of a plane or 3d model: <c>{mass: 450 kg, at: [x, y, z], directions: [z]}</c>.</summary>
    private static void ReadSpatialMass(YScalar key, YNode value, NetworkBuilder builder, SpatialNodes nodes, ReadContext context)
    {
        var space = nodes.Space;
        var what = $"mass '{key.Value}'";
        var translations = Directions.Translations(space);
        nodes.Masses[key.Value] = (null, translations);
        if (value is not YMapping entry)
        {
            context.Error(value, $"{what} needs its location in a {SpaceName(space)} model: write e.g. '{{mass: 450 kg, at: {LocationForm(space)}}}'");
            return;
        }
        context.RejectUnknownKeys(entry, what, "mass", "at", "directions");
        var kg = context.Required(entry, "mass", Quantity.Mass, MassRange, what, key.Position);
        Point3? at = null;
        if (entry["at"] is { } atNode) at = ReadLocation(atNode, space, context, $"'at' of {what}");
        else context.Error(key, $"{what} needs 'at: {LocationForm(space)}', its location in m: locations are mechanical data in a {SpaceName(space)} model");
        ImmutableArray<Direction> moves = [];
        if (entry["directions"] is { } dirNode)
        {
            if (dirNode is not YSequence { Items.Length: > 0 } seq)
                context.Error(dirNode, $"'directions' of {what} must list the translations it moves in, e.g. [z]");
            else
            {
                var list = new List<Direction>();
                foreach (var item in seq.Items)
                {
                    if (item is YScalar { Value: "rx" or "ry" or "rz" } r)
                    {
                        context.Error(item, $"'directions' of {what} names the rotation '{r.Value}': a point mass has no rotary inertia and moves in translations only; declare it under 'bodies' to let it rotate");
                        continue;
                    }
                    if (ReadDirectionWord(item, space, context, $"'directions' of {what}", translations) is not { } d) continue;
                    if (list.Contains(d)) context.Error(item, $"'directions' of {what} names '{d.Label()}' twice");
                    else list.Add(d);
                }
                moves = [.. list.Order()];
            }
        }
        nodes.Masses[key.Value] = (at, moves.IsEmpty ? translations : moves);
        if (kg is { } m && at is { } p && !context.HasErrors)
            builder.AddMass(new Mass(key.Value, m, new DrawingPosition(p.X, p.Z)) { Location = p, Moves = moves });
    }

    /// <summary>The 'at' of a support in a plane or 3d model (required: ends of axial elements and figures need it).</summary>
    private static Point3? ReadSupportLocation(YScalar key, YNode value, ModelSpace space, ReadContext context)
    {
        var what = $"support '{key.Value}'";
        if (value is YScalar { IsPlainNull: true } || (value is YMapping m && m["at"] is null))
        {
            context.Error(key, $"{what} needs 'at: {LocationForm(space)}', its location in m: locations are mechanical data in a {SpaceName(space)} model");
            return null;
        }
        if (context.Mapping(value, what) is not { } entry) return null;
        context.RejectUnknownKeys(entry, what, "at");
        return ReadLocation(entry["at"]!, space, context, $"'at' of {what}");
    }

    /// <summary>Reads 'bodies': rigid bodies with mass, centre of mass, inertia and named attachment points.</summary>
    /// <remarks>
    /// <c>skid: {mass: 1850 kg, centre-of-mass: [0, 0, 0.7], box: [2.4 m, 1.2 m, 1.4 m], points: {foot-1: [1.1, 0.5, 0]}}</c>;
    /// the inertia as matrix entries (<c>inertia: {xx, yy, zz, xy, yz, xz}</c>), principal moments with their axes
    /// (<c>principal-inertia: {values, axes}</c>) or a homogeneous box (<c>box</c>). Points are in global axes.
    /// </remarks>
    private static void ReadBodies(YMapping top, NetworkBuilder builder, SpatialNodes nodes, HashSet<string> names, ReadContext context)
    {
        if (top["bodies"] is not { } node || node is YScalar { IsPlainNull: true }) return;
        if (context.Mapping(node, "'bodies'") is not { } bodies) return;
        var space = nodes.Space;
        foreach (var (key, value) in bodies.Entries)
        {
            if (!CheckName(key, context, "body")) continue;
            var what = $"body '{key.Value}'";
            if (names.Contains(key.Value))
            {
                context.Error(key, $"{what} has the name of a mass or support; masses, supports and bodies share one set of node names");
                continue;
            }
            names.Add(key.Value);
            context.Positions[$"bodies.{key.Value}"] = key.Position;
            var points = new Dictionary<string, Point3?>(StringComparer.Ordinal);
            nodes.Bodies[key.Value] = points;
            nodes.CentresOfMass[key.Value] = null;
            if (context.Mapping(value, what) is not { } entry) continue;
            context.RejectUnknownKeys(entry, what, "mass", "centre-of-mass", "inertia", "principal-inertia", "box", "points");
            var kg = context.Required(entry, "mass", Quantity.Mass, MassRange, what, key.Position);
            Point3? com = null;
            if (entry["centre-of-mass"] is { } comNode) com = ReadLocation(comNode, space, context, $"'centre-of-mass' of {what}");
            else context.Error(key, $"{what} needs 'centre-of-mass: {LocationForm(space)}', the location of its centre of mass in m");
            nodes.CentresOfMass[key.Value] = com;

            var pointList = ImmutableArray.CreateBuilder<BodyPoint>();
            if (entry["points"] is { } pointsNode && pointsNode is not YScalar { IsPlainNull: true } && context.Mapping(pointsNode, $"'points' of {what}") is { } pm)
                foreach (var (pk, pv) in pm.Entries)
                {
                    points[pk.Value] = null;
                    if (pk.Value.Contains('.') || !NamePattern().IsMatch(pk.Value))
                    {
                        context.Error(pk, $"'{pk.Value}' is not a usable point name of {what}; use letters, digits, '_' and '-' (no '.': '{key.Value}.{pk.Value}' must name one point), starting with a letter or digit");
                        continue;
                    }
                    if (ReadLocation(pv, space, context, $"point '{pk.Value}' of {what}") is not { } p) continue;
                    points[pk.Value] = p;
                    pointList.Add(new BodyPoint(pk.Value, p));
                }

            var inertia = ReadInertia(entry, key, space, kg, what, context);
            if (kg is { } m && com is { } c && inertia is { } j && !context.HasErrors)
                builder.AddBody(new RigidBody(key.Value, m, c, j, pointList.ToImmutable()));
        }
    }

    private static readonly string[] InertiaKeys3d = ["xx", "yy", "zz", "xy", "yz", "xz"];

    /// <summary>The inertia matrix about the centre of mass from exactly one of 'inertia', 'principal-inertia' and 'box', checked.</summary>
    private static InertiaMatrix? ReadInertia(YMapping entry, YScalar key, ModelSpace space, double? kg, string what, ReadContext context)
    {
        // In the order written, so a second form is reported where it stands.
        var givenKeys = entry.Entries.Select(e => e.Key).Where(k => k.Value is "inertia" or "principal-inertia" or "box").ToArray();
        var given = givenKeys.Select(k => k.Value).ToArray();
        if (given.Length != 1)
        {
            var at = given.Length == 0 ? key.Position : givenKeys[1].Position;
            var forms = space == ModelSpace.Plane
                ? "'inertia: {yy: 620 kg*m^2}' (about y through the centre of mass) or 'box: [dx, dz]'"
                : "'inertia: {xx, yy, zz, xy, yz, xz}' (matrix entries), 'principal-inertia: {values, axes}' or 'box: [dx, dy, dz]'";
            context.Error(at, $"{what} needs exactly one of {forms}");
            return null;
        }
        var node = entry[given[0]]!;
        var where = $"'{given[0]}' of {what}";
        switch (given[0])
        {
            case "box":
            {
                var count = space == ModelSpace.Plane ? 2 : 3;
                if (node is not YSequence { } seq || seq.Items.Length != count)
                {
                    context.Error(node, $"{where} must list the box's edges {(space == ModelSpace.Plane ? "[dx, dz]" : "[dx, dy, dz]")} in m, along the global axes");
                    return null;
                }
                var edges = seq.Items.Select(i => context.Value(i, Quantity.Length, SpacingRange, where)).ToArray();
                if (kg is not { } m || edges.Any(e => e is null)) return null;
                return space == ModelSpace.Plane
                    ? InertiaMatrix.OfBox(m, edges[0]!.Value, 0, edges[1]!.Value) with { Xx = 0, Zz = 0 }
                    : InertiaMatrix.OfBox(m, edges[0]!.Value, edges[1]!.Value, edges[2]!.Value);
            }
            case "inertia":
            {
                if (context.Mapping(node, where) is not { } map) return null;
                if (space == ModelSpace.Plane)
                {
                    foreach (var (k, _) in map.Entries.Where(e => e.Key.Value != "yy"))
                        context.Error(k, $"{where} has '{k.Value}', but a plane model rotates about y only: give 'inertia: {{yy: ...}}'");
                    var yy = context.Required(map, "yy", Quantity.MomentOfInertia, InertiaRange, where);
                    return yy is { } j ? new InertiaMatrix(0, j, 0) : null;
                }
                context.RejectUnknownKeys(map, where, InertiaKeys3d);
                var v = new double?[6];
                for (var i = 0; i < 6; i++)
                    v[i] = i < 3 ? context.Required(map, InertiaKeys3d[i], Quantity.MomentOfInertia, InertiaRange, where)
                                 : context.Optional(map, InertiaKeys3d[i], Quantity.MomentOfInertia, OffDiagonalInertiaRange, where) ?? 0;
                if (v.Any(x => x is null)) return null;
                var matrix = new InertiaMatrix(v[0]!.Value, v[1]!.Value, v[2]!.Value, v[3]!.Value, v[4]!.Value, v[5]!.Value);
                return CheckInertia(matrix, node, where, context) ? matrix : null;
            }
            default:
            {
                if (space == ModelSpace.Plane)
                {
                    context.Error(node, $"{where}: a plane model rotates about y only; give 'inertia: {{yy: ...}}' instead");
                    return null;
                }
                if (context.Mapping(node, where) is not { } map) return null;
                context.RejectUnknownKeys(map, where, "values", "axes");
                double[]? values = null;
                if (map["values"] is not { } vNode) context.Error(map, $"{where} needs 'values: [I1, I2, I3]', the principal moments of inertia");
                else if (vNode is not YSequence { Items.Length: 3 } vs) context.Error(vNode, $"'values' of {where} must list three principal moments, e.g. [420 kg*m^2, 610 kg*m^2, 560 kg*m^2]");
                else
                {
                    var read = vs.Items.Select(i => context.Value(i, Quantity.MomentOfInertia, InertiaRange, $"'values' of {where}")).ToArray();
                    if (read.All(r => r is not null)) values = [.. read.Select(r => r!.Value)];
                }
                Point3[]? axes = null;
                if (map["axes"] is not { } aNode) context.Error(map, $"{where} needs 'axes: [[x, y, z], [x, y, z], [x, y, z]]', the directions of the three principal axes in global axes");
                else axes = ReadAxes(aNode, $"'axes' of {where}", context);
                if (values is null || axes is null) return null;
                if (!CheckTriangle(values, node, where, context)) return null;
                return InertiaMatrix.FromPrincipal(values, axes);
            }
        }
    }

    private static readonly Range InertiaRange = new(1e-9, 1e12);                                  // kg·m² (a subnormal moment made NaN frequencies)
    private static readonly Range OffDiagonalInertiaRange = new(-1e12, 1e12);                     // kg·m²

    /// <summary>Three mutually perpendicular directions (plain numbers), each scaled to unit length.</summary>
    private static Point3[]? ReadAxes(YNode node, string what, ReadContext context)
    {
        if (node is not YSequence { Items.Length: 3 } seq)
        {
            context.Error(node, $"{what} must list three axes, e.g. [[1, 0, 0], [0, 1, 0], [0, 0, 1]]");
            return null;
        }
        var axes = new Point3[3];
        for (var i = 0; i < 3; i++)
        {
            if (seq.Items[i] is not YSequence { Items.Length: 3 } a)
            {
                context.Error(seq.Items[i], $"axis {i + 1} of {what} must be a direction [x, y, z]");
                return null;
            }
            var c = a.Items.Select(item => PlainNumber(item, $"axis {i + 1} of {what}", context)).ToArray();
            if (c.Any(x => x is null)) return null;
            var v = new Point3(c[0]!.Value, c[1]!.Value, c[2]!.Value);
            if (!(v.Length > 0))
            {
                context.Error(a, $"axis {i + 1} of {what} has zero length; give its direction");
                return null;
            }
            axes[i] = new Point3(v.X / v.Length, v.Y / v.Length, v.Z / v.Length);
        }
        for (var i = 0; i < 3; i++)
            for (var j = i + 1; j < 3; j++)
            {
                var cos = axes[i].X * axes[j].X + axes[i].Y * axes[j].Y + axes[i].Z * axes[j].Z;
                if (Math.Abs(cos) > 1e-6)
                {
                    context.Error(seq.Items[j], string.Create(CultureInfo.InvariantCulture,
                        $"axes {i + 1} and {j + 1} of {what} are not perpendicular (the cosine of their angle is {cos:0.######}); principal axes are mutually perpendicular"));
                    return null;
                }
            }
        return axes;
    }

    private static double? PlainNumber(YNode node, string what, ReadContext context)
    {
        if (node is YScalar { IsPlainNull: false } s && double.TryParse(s.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out var v) && double.IsFinite(v))
            return v;
        context.Error(node, $"{what} must be a plain number");
        return null;
    }

    /// <summary>Refuses an inertia matrix that is not positive definite, or whose principal moments no real body has.</summary>
    /// <remarks>
    /// The principal moments are the eigenvalues of J (closed form for a symmetric 3×3 matrix). Positive definite:
    /// the smallest above 10⁻¹² of the largest. Physical: each principal moment at most the sum of the other two
    /// (I₁ = ∫(y² + z²) dm ≤ I₂ + I₃ = ∫(x² + y² + 2z²) dm), with equality only for a body flat in one plane.
    /// </remarks>
    private static bool CheckInertia(InertiaMatrix j, YNode node, string what, ReadContext context)
    {
        var moments = PrincipalMoments(j);
        if (!(moments[0] > 1e-12 * moments[2]))
        {
            context.Error(node, $"{what} is not positive definite (principal moments {FormatMoments(moments)} kg*m^2): check the off-diagonal entries and their signs (matrix entries, J_xy = -∫xy dm, the negative of the product of inertia)");
            return false;
        }
        return CheckTriangle(moments, node, what, context);
    }

    private static bool CheckTriangle(IReadOnlyList<double> moments, YNode node, string what, ReadContext context)
    {
        var sorted = moments.Order().ToArray();
        if (sorted[2] <= (sorted[0] + sorted[1]) * (1 + 1e-9)) return true;
        context.Error(node, $"{what} has principal moments {FormatMoments(sorted)} kg*m^2: the largest exceeds the sum of the other two, which no real mass distribution gives (each principal moment is at most the sum of the other two)");
        return false;
    }

    private static string FormatMoments(IEnumerable<double> m) => string.Join(", ", m.Select(x => x.ToString("G4", CultureInfo.InvariantCulture)));

    /// <summary>The eigenvalues of the symmetric matrix J in ascending order (the trigonometric closed form, Smith 1961).</summary>
    internal static double[] PrincipalMoments(InertiaMatrix j)
    {
        var p1 = j.Xy * j.Xy + j.Yz * j.Yz + j.Xz * j.Xz;
        double[] e;
        if (p1 == 0) e = [j.Xx, j.Yy, j.Zz];
        else
        {
            var q = (j.Xx + j.Yy + j.Zz) / 3;
            var p2 = (j.Xx - q) * (j.Xx - q) + (j.Yy - q) * (j.Yy - q) + (j.Zz - q) * (j.Zz - q) + 2 * p1;
            var p = Math.Sqrt(p2 / 6);
            double b11 = (j.Xx - q) / p, b22 = (j.Yy - q) / p, b33 = (j.Zz - q) / p, b12 = j.Xy / p, b23 = j.Yz / p, b13 = j.Xz / p;
            var det = b11 * (b22 * b33 - b23 * b23) - b12 * (b12 * b33 - b23 * b13) + b13 * (b12 * b23 - b22 * b13);
            var r = Math.Clamp(det / 2, -1, 1);
            var phi = Math.Acos(r) / 3;
            var largest = q + 2 * p * Math.Cos(phi);
            var smallest = q + 2 * p * Math.Cos(phi + 2 * Math.PI / 3);
            e = [largest, 3 * q - largest - smallest, smallest];
        }
        Array.Sort(e);
        return e;
    }

    /// <summary>Resolves an element end or a load target: a mass, support or body by name, or <c>body.point</c>; null after an error at <paramref name="node"/>.</summary>
    private static End? ResolveEnd(YNode node, string text, SpatialNodes nodes, ReadContext context, string what)
    {
        if (nodes.Masses.TryGetValue(text, out var mass)) return new End(text, text, EndKind.Mass, mass.Location, mass.Moves);
        if (nodes.Nodes.TryGetValue(text, out var massless)) return new End(text, text, EndKind.Node, massless.Location, massless.Moves);
        if (nodes.Supports.TryGetValue(text, out var support)) return new End(text, text, EndKind.Support, support, []);
        var all = Directions.All(nodes.Space);
        if (nodes.Bodies.ContainsKey(text)) return new End(text, text, EndKind.Body, nodes.CentresOfMass[text], all);
        var dot = text.LastIndexOf('.');
        if (dot > 0 && nodes.Bodies.TryGetValue(text[..dot], out var points))
        {
            var body = text[..dot];
            var point = text[(dot + 1)..];
            if (points.TryGetValue(point, out var at)) return new End(text, body, EndKind.Body, at, all);
            var known = points.Count == 0 ? $"body '{body}' declares no 'points'" : $"its points are {string.Join(", ", points.Keys)}";
            context.Error(node, $"{what} refers to '{text}', but body '{body}' has no point '{point}'{ReadContext.Suggest(point, points.Keys)}; {known}");
            return null;
        }
        context.Error(node, $"{what} refers to unknown node '{text}'{ReadContext.Suggest(text, nodes.Names)}; declare it under 'masses', 'nodes', 'supports' or 'bodies', use 'body.point' for a point of a body, or 'ground'");
        return null;
    }

    private static string Describe(End end) => end.Kind switch
    {
        EndKind.Support => $"support '{end.Node}'",
        EndKind.Body => $"body '{end.Node}'",
        EndKind.Node => $"massless node '{end.Node}'",
        _ => $"mass '{end.Node}'",
    };

    /// <summary>A spring or damper of a plane or 3d model, in SI.</summary>
    private sealed record SpatialElement(string Name, string A, string B, double Scale, ImmutableArray<DirectionalValue> Components, bool Axial);

    /// <summary>The vocabulary of one two-node element section of a plane or 3d model: its keys, quantities, ranges and the examples its messages give.</summary>
    private sealed record SpatialElementKind(string Section, string Element, string ValueKey, string RotationKey, Quantity Quantity, Range Range,
        Quantity RotationQuantity, Range RotationRange, string PlaneExample, string SpaceExample, string ExampleBetween);

    // Properties, not fields: the ranges they take are static fields of other files of this partial class, whose
    // initialisation order relative to these is not defined.
    private static SpatialElementKind SpringKind => new("springs", "spring", "stiffness", "rotational-stiffness",
        Quantity.Stiffness, StiffnessRange, Quantity.RotationalStiffness, RotationalStiffnessRange,
        "{x: 0.8 kN/mm, z: 2.4 kN/mm}", "{x: 0.8 kN/mm, y: 0.8 kN/mm, z: 2.4 kN/mm}", "skid.foot-1, ground");

    private static SpatialElementKind DamperKind => new("dampers", "damper", "coefficient", "rotational-coefficient",
        Quantity.Damping, DampingRange, Quantity.RotationalDamping, RotationalDampingRange,
        "{z: 1.5 kN*s/m}", "{x: 1.5 kN*s/m, y: 1.5 kN*s/m, z: 1.5 kN*s/m}", "skid.foot-1, ground");

    /// <summary>Reads 'springs', 'dampers' or 'inerters' of a plane or 3d model: components per direction, or axial.</summary>
    private static List<SpatialElement> ReadSpatialElements(YMapping top, SpatialElementKind kind, SpatialNodes nodes, ReadContext context)
    {
        var result = new List<SpatialElement>();
        var (section, element, valueKey, rotationKey) = (kind.Section, kind.Element, kind.ValueKey, kind.RotationKey);
        var (quantity, range, rotQuantity, rotRange) = (kind.Quantity, kind.Range, kind.RotationQuantity, kind.RotationRange);
        if (top[section] is not { } sectionNode || sectionNode is YScalar { IsPlainNull: true }) return result;
        if (context.Mapping(sectionNode, $"'{section}'") is not { } mapping) return result;
        var space = nodes.Space;
        var example = space == ModelSpace.Plane ? kind.PlaneExample : kind.SpaceExample;

        foreach (var (key, value) in mapping.Entries)
        {
            if (!CheckName(key, context, element)) continue;
            var what = $"{element} '{key.Value}'";
            context.Positions[$"{section}.{key.Value}"] = key.Position;
            if (value is not YMapping entry)
            {
                context.Error(value, $"{what} must be a mapping such as '{{between: [{kind.ExampleBetween}], {valueKey}: {example}}}'");
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
                else ok &= ReadComponents(compNode, $"'{valueKey}' of {what}", Directions.Translations(space), quantity, range, rotationKey, space, components, context);
            }
            if (entry[rotationKey] is { } rotNode)
                ok &= ReadComponents(rotNode, $"'{rotationKey}' of {what}", Directions.Rotations(space), rotQuantity, rotRange, valueKey, space, components, context);
            double? axial = null;
            if (entry["axial"] is { } axialNode)
            {
                if (entry[valueKey] is not null || entry[rotationKey] is not null)
                {
                    context.Error(axialNode, $"{what} has 'axial' and per-direction values; give one: 'axial' acts along the line between its ends, '{valueKey}' and '{rotationKey}' act per global direction (declare two {section} for both)");
                    ok = false;
                }
                else axial = context.Value(axialNode, quantity, range, $"'axial' of {what}");
                ok &= axial is not null;
            }
            else if (entry[valueKey] is null && entry[rotationKey] is null)
            {
                context.Error(key, $"{what} needs '{valueKey}: {example}' (per global direction) or 'axial: ...' (along the line between its ends)");
                ok = false;
            }
            if (ends is not var (a, b) || !ok) continue;

            if (axial is { } k)
            {
                if (CheckAxialEnds(a, b, entry["between"]!, what, context))
                    result.Add(new SpatialElement(key.Value, a.Reference, b.Reference, k, [], true));
                continue;
            }
            foreach (var (c, cKey) in components)
            {
                if (c.Direction.IsRotation())
                {
                    var pointMass = a.Kind is EndKind.Mass or EndKind.Node ? a : b.Kind is EndKind.Mass or EndKind.Node ? b : (End?)null;
                    if (pointMass is { } pm)
                    {
                        context.Error(cKey, $"{what} has a rotational component '{c.Direction.Label()}', but its end {Describe(pm)} is a point mass, which has no rotation; attach it to a body (or a support)");
                        ok = false;
                        continue;
                    }
                }
                if (!a.Moves.Contains(c.Direction) && !b.Moves.Contains(c.Direction))
                {
                    context.Error(cKey, $"{what} acts in '{c.Direction.Label()}', but neither {Describe(a)} ({MovesText(a)}) nor {Describe(b)} ({MovesText(b)}) moves in '{c.Direction.Label()}': it would carry no force");
                    ok = false;
                }
            }
            if (!ok) continue;
            var scale = components.Where(c => !c.Value.Direction.IsRotation()).Select(c => c.Value.Value).DefaultIfEmpty(0).Max();
            result.Add(new SpatialElement(key.Value, a.Reference, b.Reference, scale, [.. components.Select(c => c.Value).OrderBy(c => c.Direction)], false));
        }
        return result;
    }

    private static string MovesText(End end) => end.Moves.IsEmpty ? "it does not move" : $"moves in {DirectionList(end.Moves)}";

    private static bool ReadComponents(YNode node, string what, ImmutableArray<Direction> allowed, Quantity quantity, Range range, string otherKey,
        ModelSpace space, List<(DirectionalValue, YNode)> into, ReadContext context)
    {
        if (context.Mapping(node, what) is not { } map) return false;
        if (map.Entries.Length == 0)
        {
            context.Error(map, $"{what} gives no direction; list e.g. {{{allowed[0].Label()}: ...}}");
            return false;
        }
        var ok = true;
        foreach (var (k, v) in map.Entries)
        {
            if (Directions.Parse(k.Value) is { } d && Directions.All(space).Contains(d) && !allowed.Contains(d))
            {
                context.Error(k, $"{what} names '{k.Value}', which belongs under '{otherKey}'");
                ok = false;
                continue;
            }
            if (ReadDirectionWord(k, space, context, $"a direction of {what}", allowed) is not { } direction) { ok = false; continue; }
            if (context.Value(v, quantity, range, $"'{k.Value}' of {what}") is not { } x) { ok = false; continue; }
            into.Add((new DirectionalValue(direction, x), k));
        }
        return ok;
    }

    private static (End A, End B)? ReadSpatialEnds(YMapping entry, SourcePosition owner, SpatialNodes nodes, ReadContext context, string what)
    {
        if (BetweenPair(entry, owner, context, what, "its two ends: masses, supports, bodies or body points ('body.point')", "ends, e.g. [skid.foot-1, ground]") is not { } seq) return null;
        var ends = new End?[2];
        for (var i = 0; i < 2; i++)
            if (context.Text(seq.Items[i], $"'between' of {what}") is { } text)
                ends[i] = ResolveEnd(seq.Items[i], text, nodes, context, what);
        if (ends[0] is not { } a || ends[1] is not { } b) return null;
        if (a.Node == b.Node)
        {
            context.Error(seq, a.Kind == EndKind.Body && a.Reference != b.Reference
                ? $"{what} joins '{a.Reference}' and '{b.Reference}', two points of the one rigid body '{a.Node}': it would carry no force; its ends must be on different nodes"
                : $"{what} connects '{a.Reference}' to itself; its two ends must differ");
            return null;
        }
        if (a.Kind == EndKind.Support && b.Kind == EndKind.Support)
        {
            context.Error(seq, $"{what} joins two supports ('{a.Node}' and '{b.Node}'), which do not move: it would carry no force");
            return null;
        }
        return (a, b);
    }

    private static bool CheckAxialEnds(End a, End b, YNode between, string what, ReadContext context)
    {
        foreach (var e in new[] { a, b })
            if (e.Location is null)
            {
                // Only ground has no location (everything else needs one, or its error was reported already).
                if (e.Node == CoreNetwork.Ground)
                    context.Error(between, $"{what} is axial, but 'ground' has no location to take its line from; declare a support with 'at' and connect to that");
                return false;
            }
        if ((a.Location!.Value - b.Location!.Value).Length < 1e-9)
        {
            context.Error(between, $"{what} is axial, but its ends '{a.Reference}' and '{b.Reference}' are at the same location: an axial element needs a length to take its line from; give per-direction values instead");
            return false;
        }
        return true;
    }

    /// <summary>Reads 'reference-point' (plane and 3d models): the point rotational effective masses are taken about.</summary>
    private static Point3? ReadReferencePoint(YMapping top, ModelSpace space, ReadContext context)
    {
        if (top["reference-point"] is not { } node) return null;
        if (space == ModelSpace.Line)
        {
            RefuseInLine(top, "reference-point", "the model file", context);
            return null;
        }
        return ReadLocation(node, space, context, "'reference-point'");
    }

    /// <summary>Refuses the sections a plane or 3d model cannot use yet, and the spatial keys of a line model.</summary>
    private static void CheckSectionsForSpace(YMapping top, ModelSpace space, ReadContext context)
    {
        if (space == ModelSpace.Line)
        {
            RefuseInLine(top, "bodies", "the model file", context);
            return;
        }
        foreach (var (k, _) in top.Entries)
        {
            if (k.Value == "links")
                context.Error(k, $"'links' cannot be used in a {SpaceName(space)} model: masses that move together are one rigid body; declare it under 'bodies'");
            else if (k.Value == "repeat")
                context.Error(k, $"'repeat' makes masses of line models only: in a {SpaceName(space)} model write the masses with their locations under 'masses'");
        }
    }

    /// <summary>The target of a force or unbalance: a mass (line models), or a mass, body or body point (plane and 3d).</summary>
    private static End? LoadTarget(YMapping entry, IReadOnlySet<string> masses, SpatialNodes? nodes, string what, ReadContext context)
    {
        if (nodes is null)
            return LoadMass(entry, masses, what, context) is { } mass ? new End(mass, mass, EndKind.Mass, null, [Direction.Along]) : null;
        if (entry["at"] is not { } node)
        {
            context.Error(entry, $"{what} needs 'at': the mass, body or body point ('body.point') it acts on");
            return null;
        }
        if (context.Text(node, $"'at' of {what}") is not { } text) return null;
        if (ResolveEnd(node, text, nodes, context, what) is not { } end) return null;
        if (end.Kind == EndKind.Node)
        {
            context.Error(node, $"{what} acts at {Describe(end)}; loads act on masses, bodies and body points, as in line models (a massless node has no inertia to load)");
            return null;
        }
        if (end.Kind == EndKind.Support)
        {
            context.Error(node, $"{what} acts at {Describe(end)}, which does not move; apply it to a mass or a body (or use kind: base-motion)");
            return null;
        }
        return end;
    }

    /// <summary>The direction of a force (a rotation = a moment) or of a support's motion; Along in line models.</summary>
    private static Direction? LoadDirection(YMapping entry, End? target, SpatialNodes? nodes, bool supportMotion, string what, ReadContext context)
    {
        if (nodes is null)
        {
            RefuseInLine(entry, "direction", what, context);
            return entry["direction"] is null ? Direction.Along : null;
        }
        var space = nodes.Space;
        if (entry["direction"] is not { } node)
        {
            context.Error(entry, supportMotion
                ? $"{what} needs 'direction' in a {SpaceName(space)} model: the translation the support moves in ({DirectionList(Directions.Translations(space))})"
                : $"{what} needs 'direction' in a {SpaceName(space)} model: {DirectionList(Directions.Translations(space))} for a force, {DirectionList(Directions.Rotations(space))} for a moment on a body");
            return null;
        }
        var allowed = supportMotion ? Directions.Translations(space) : Directions.All(space);
        if (supportMotion && node is YScalar { Value: "rx" or "ry" or "rz" })
        {
            context.Error(node, $"'direction' of {what} is a rotation; a support's prescribed motion is a translation ({DirectionList(allowed)})");
            return null;
        }
        if (ReadDirectionWord(node, space, context, $"'direction' of {what}", allowed) is not { } d) return null;
        if (target is { Kind: EndKind.Mass } mass && !mass.Moves.Contains(d))
        {
            context.Error(node, d.IsRotation()
                ? $"{what} is a moment ('{d.Label()}') on {Describe(mass)}, a point mass, which has no rotation; apply moments to a body"
                : $"{what} acts in '{d.Label()}' on {Describe(mass)}, which moves only in {DirectionList(mass.Moves)}");
            return null;
        }
        return d;
    }

    /// <summary>The plane an unbalance rotates in: two different translations; [x, z] by default in a plane model, empty in line models.</summary>
    private static ImmutableArray<Direction>? UnbalancePlane(YMapping entry, End? target, SpatialNodes? nodes, string what, ReadContext context)
    {
        if (nodes is null)
        {
            RefuseInLine(entry, "plane", what, context);
            return entry["plane"] is null ? [] : null;
        }
        var space = nodes.Space;
        var translations = Directions.Translations(space);
        ImmutableArray<Direction> plane;
        YNode? node = entry["plane"];
        if (node is null)
        {
            if (space != ModelSpace.Plane)
            {
                context.Error(entry, $"{what} needs 'plane: [x, z]' (or [x, y], [y, z]): the two translations spanning the plane it rotates in; the force is cos along the first, sin along the second");
                return null;
            }
            plane = [Direction.X, Direction.Z];
        }
        else
        {
            if (node is not YSequence { Items.Length: 2 } seq)
            {
                context.Error(node, $"'plane' of {what} must list two translations, e.g. [x, z]");
                return null;
            }
            var d = seq.Items.Select(i => ReadDirectionWord(i, space, context, $"'plane' of {what}", translations)).ToArray();
            if (d[0] is null || d[1] is null) return null;
            if (d[0] == d[1])
            {
                context.Error(seq, $"'plane' of {what} names '{d[0]!.Value.Label()}' twice; give two different translations");
                return null;
            }
            plane = [d[0]!.Value, d[1]!.Value];
        }
        if (target is { Kind: EndKind.Mass } mass && plane.Where(p => !mass.Moves.Contains(p)).ToArray() is [var missing, ..])
        {
            context.Error(node ?? entry, $"{what} rotates in the plane [{DirectionList(plane)}], but {Describe(mass)} moves only in {DirectionList(mass.Moves)}; apply it to a body, or let the mass move in '{missing.Label()}'");
            return null;
        }
        return plane;
    }

    /// <summary>Warnings of a plane or 3d model: nodes no element touches, and groups not joined to a support (each means rigid-body modes).</summary>
    private static void WarnAboutSpatialConnectivity(CoreNetwork network, ReadContext context)
    {
        string NodeOf(string reference) => network.Resolve(reference)?.Node ?? reference;
        var parent = new Dictionary<string, string>(StringComparer.Ordinal);
        string Find(string x)
        {
            while (parent[x] != x) x = parent[x] = parent[parent[x]];
            return x;
        }
        foreach (var name in network.Masses.Select(m => m.Name).Concat(network.Bodies.Select(b => b.Name))) parent[name] = name;
        foreach (var s in network.Supports) parent[s.Name] = CoreNetwork.Ground;
        parent[CoreNetwork.Ground] = CoreNetwork.Ground;
        var touched = new HashSet<string>(StringComparer.Ordinal);
        foreach (var s in network.Springs.Where(s => s.Stiffness > 0 || s.Components.Any(c => c.Value > 0)))
        {
            var (a, b) = (NodeOf(s.NodeA), NodeOf(s.NodeB));
            touched.Add(a);
            touched.Add(b);
            parent[Find(a)] = Find(b);
        }
        var held = Find(CoreNetwork.Ground);
        // Massless nodes have no rigid-body mode of their own (they are condensed or first-order states): not warned about.
        var nodes = network.Masses.Where(m => m.Kilograms > 0).Select(m => (Name: m.Name, Kind: "mass", Key: $"masses.{m.Name}"))
            .Concat(network.Bodies.Select(b => (Name: b.Name, Kind: "body", Key: $"bodies.{b.Name}"))).ToList();
        foreach (var (name, kind, key) in nodes.Where(n => !touched.Contains(n.Name)))
            if (context.Positions.TryGetValue(key, out var at))
                context.Warning(at, $"{kind} '{name}' has no spring: nothing holds it, so it has rigid-body modes (reported at 0 Hz)");
        foreach (var group in nodes.Where(n => touched.Contains(n.Name) && Find(n.Name) != held).GroupBy(n => Find(n.Name)))
            if (context.Positions.TryGetValue(group.First().Key, out var at))
                context.Warning(at, $"{string.Join(", ", group.Select(n => $"{n.Kind} '{n.Name}'"))} {(group.Count() == 1 ? "is" : "are")} not connected to a support by springs: " +
                    "that part of the model has rigid-body modes (reported at 0 Hz)");
    }
}
