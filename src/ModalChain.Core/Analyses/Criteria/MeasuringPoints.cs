using System.Collections.Immutable;
using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Criteria;

/// <summary>One translation a criterion measures: its label and its motion as a combination of the model's DOFs.</summary>
/// <param name="Label">What outputs print: the mass name in a line model, <c>deck.z</c> or <c>skid.bearing.x</c> in plane and 3d models.</param>
/// <param name="Terms">The motion as Σ coefficient · u[DOF], each DOF by its label (coefficients dimensionless or m/rad).</param>
public sealed record MeasuredMotion(string Label, ImmutableArray<(string Dof, double Coefficient)> Terms)
{
    /// <summary>The complex amplitude of this motion from the amplitudes of its DOFs.</summary>
    public Complex Of(Func<string, Complex> dof)
    {
        ArgumentNullException.ThrowIfNull(dof);
        var sum = Complex.Zero;
        foreach (var (label, c) in Terms) sum += c == 1 ? dof(label) : c * dof(label);
        return sum;
    }
}

/// <summary>Where a criterion applies, resolved: one measured translation, or every translation of a point (the largest governs).</summary>
/// <param name="At">The name as written in the model.</param>
/// <param name="Motions">One motion (a DOF label, or a point with a direction), or each translation of a bare point or node.</param>
public sealed record MeasuringPoint(string At, ImmutableArray<MeasuredMotion> Motions)
{
    /// <summary>True when <see cref="At"/> names a point measured in several directions, of which the largest response is reported.</summary>
    public bool TakesLargest => Motions.Length > 1;
}

/// <summary>Resolves the <c>at</c> of a vibration limit, machine zone or floor curve into the motions it measures.</summary>
/// <remarks>
/// A line model measures a mass along its line. A plane or 3d model accepts: a node or body point with a translation,
/// <c>deck.z</c>, <c>skid.x</c> (the centre of mass) or <c>skid.bearing.x</c>, the point's motion
/// u_p = u_c + θ × (p − c) in that direction (<see cref="AttachmentMap"/>); or a bare mass, body or body point, which
/// stands for every translation it has, the largest governing (a bearing housing is measured in three directions and
/// the largest taken: common practice, as in the ISO 20816 series). Rotations are refused: the limits are in length
/// units. A point named like a direction (<c>skid.x</c> as a point) is reached with its direction: <c>skid.x.z</c>.
/// </remarks>
public sealed class MeasuringPoints
{
    private readonly Network _network;
    private DofMap? _dofs;
    private AttachmentMap.Resolver? _resolver;

    /// <summary>A resolver over <paramref name="network"/>.</summary>
    public MeasuringPoints(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        _network = network;
    }

    /// <summary>The point <paramref name="at"/> names, or null with the reason in <paramref name="error"/>.</summary>
    /// <param name="at">The name as written.</param>
    /// <param name="error">Why nothing could be measured there: a sentence fragment following the name, such as "is not a mass of the model".</param>
    /// <param name="unknown">True when <paramref name="at"/> names nothing at all (a caller may suggest a near name).</param>
    public MeasuringPoint? Resolve(string at, out string? error, out bool unknown)
    {
        ArgumentNullException.ThrowIfNull(at);
        error = null;
        unknown = false;
        if (_network.Space == ModelSpace.Line)
        {
            if (_network.IsMass(at)) return new MeasuringPoint(at, [new MeasuredMotion(at, [(at, 1.0)])]);
            (error, unknown) = ("is not a mass of the model", true);
            return null;
        }
        var translations = Directions.Translations(_network.Space);
        var dot = at.LastIndexOf('.');
        if (dot > 0 && Directions.Parse(at[(dot + 1)..]) is { } direction && Attachment(at[..dot]) is { } directed)
        {
            if (direction.IsRotation())
            {
                error = $"is a rotation ('{direction.Label()}'); limits, machine zones and floor curves bound motion in length units: name a translation ({string.Join(", ", translations.Select(d => $"{at[..dot]}.{d.Label()}"))})";
                return null;
            }
            if (!translations.Contains(direction))
            {
                error = $"names '{direction.Label()}', a direction a {SpaceName} model does not have: its translations are {string.Join(", ", translations.Select(d => d.Label()))}";
                return null;
            }
            if (Motion(at, directed, direction) is { } motion) return new MeasuringPoint(at, [motion]);
            error = $"names '{direction.Label()}', but '{at[..dot]}' does not move in '{direction.Label()}'";
            return null;
        }
        if (Attachment(at) is { } point)
        {
            var motions = translations.Select(d => Motion($"{at}.{d.Label()}", point, d)).OfType<MeasuredMotion>().ToImmutableArray();
            if (!motions.IsEmpty) return new MeasuringPoint(at, motions);
            error = "does not move in any translation";
            return null;
        }
        error = _network.IsSupport(at) || (dot > 0 && _network.IsSupport(at[..dot]))
            ? "is a support: it does not move in this analysis; name a mass, a body or a body point ('body.point')"
            : "is not a mass, body, body point ('body.point') or translation ('mass.z', 'body.point.x') of the model";
        unknown = !_network.IsSupport(at);
        return null;
    }

    /// <summary>Every name a criterion may use (masses, bodies, body points), for suggestions.</summary>
    public IEnumerable<string> Names() => _network.Space == ModelSpace.Line
        ? _network.Masses.Select(m => m.Name)
        : _network.Masses.Select(m => m.Name).Concat(_network.Bodies.SelectMany(b => b.Points.Select(p => $"{b.Name}.{p.Name}").Prepend(b.Name)));

    private string SpaceName => _network.Space == ModelSpace.Plane ? "plane" : "3d";

    /// <summary>The attachment of a mass, body or body point (never a support), or null.</summary>
    private AttachmentMap? Attachment(string reference)
    {
        if (_network.Resolve(reference) is not { } a || _network.IsSupport(a.Node)) return null;
        _dofs ??= DofMap.For(_network);
        _resolver ??= new AttachmentMap.Resolver(_network, _dofs);
        return _resolver.Of(reference);
    }

    /// <summary>The point's motion in <paramref name="direction"/>, or null when the node does not move in it.</summary>
    private MeasuredMotion? Motion(string label, AttachmentMap point, Direction direction)
    {
        var row = point.Row(direction);
        if (row.Count == 0) return null;
        return new MeasuredMotion(label, [.. row.Select(t => (_dofs!.Label(t.Dof), t.Coefficient))]);
    }
}

/// <summary>The response components of measured motions, from the components of the DOFs they combine.</summary>
internal static class MeasuredResponse
{
    /// <summary>Each distinct name of <paramref name="at"/> resolved: the point, or the reason it cannot be measured.</summary>
    public static Dictionary<string, (MeasuringPoint? Point, string? Reason)> Resolve(Network network, IEnumerable<string> at)
    {
        var points = new MeasuringPoints(network);
        var result = new Dictionary<string, (MeasuringPoint?, string?)>(StringComparer.Ordinal);
        foreach (var name in at)
            if (!result.ContainsKey(name))
                result[name] = points.Resolve(name, out var error, out _) is { } p ? (p, null) : (null, $"'{name}' {error}");
        return result;
    }

    /// <summary>The DOF labels the resolved points need, each once.</summary>
    public static string[] Dofs(IEnumerable<(MeasuringPoint? Point, string? Reason)> points) =>
        [.. points.Where(p => p.Point is not null).SelectMany(p => p.Point!.Motions.SelectMany(m => m.Terms.Select(t => t.Dof))).Distinct(StringComparer.Ordinal)];

    /// <summary>The components of <paramref name="motion"/>: at each operating point, Σ c_j X_j over its DOFs.</summary>
    public static List<HarmonicComponent> Of(MeasuredMotion motion, IReadOnlyDictionary<string, List<HarmonicComponent>> dofs)
    {
        var first = dofs[motion.Terms[0].Dof];
        return [.. first.Select((c, k) => c with { Displacement = motion.Of(d => dofs[d][k].Displacement) })];
    }

    /// <summary>The components of <paramref name="motion"/>: for each case and running speed, Σ c_j X_j over its DOFs.</summary>
    public static List<CaseComponent> Of(MeasuredMotion motion, IReadOnlyDictionary<string, List<CaseComponent>> dofs)
    {
        var first = dofs[motion.Terms[0].Dof];
        return [.. first.Select((c, k) => c with { Displacement = motion.Of(d => dofs[d][k].Displacement) })];
    }

    /// <summary>The result of the motion with the largest <paramref name="value"/> (the first of equals), with its label.</summary>
    public static (T Result, string Label) Largest<T>(MeasuringPoint point, Func<MeasuredMotion, T> evaluate, Func<T, double> value)
    {
        var best = (Result: evaluate(point.Motions[0]), Label: point.Motions[0].Label);
        foreach (var m in point.Motions.Skip(1))
        {
            var r = evaluate(m);
            if (value(r) > value(best.Result)) best = (r, m.Label);
        }
        return best;
    }
}
