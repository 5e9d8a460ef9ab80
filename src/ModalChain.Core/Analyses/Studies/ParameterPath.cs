using System.Collections.Immutable;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Core.Units;

namespace ModalChain.Core.Analyses.Studies;

/// <summary>Which numeric field of which element a study varies.</summary>
public enum ParameterKind
{
    /// <summary>masses.NAME.mass, kg.</summary>
    Mass,
    /// <summary>springs.NAME.stiffness (or one direction of it), N/m or N·m/rad.</summary>
    Stiffness,
    /// <summary>dampers.NAME.coefficient (or one direction of it), N·s/m or N·m·s/rad.</summary>
    DamperCoefficient,
    /// <summary>bodies.NAME.mass, kg (plane and 3d models); the body's inertia is kept.</summary>
    BodyMass,
    /// <summary>inerters.NAME.inertance (or one direction of it), kg or kg·m²/rad.</summary>
    Inertance,
    /// <summary>transducers.NAME.force-factor, T·m (line models); positive.</summary>
    ForceFactor,
}

/// <summary>A numeric field of a network addressed as in the model file: <c>section.name.field</c>.</summary>
/// <param name="Kind">What the field is.</param>
/// <param name="Element">The element's name.</param>
/// <remarks>
/// <para>In plane and 3d models a spring or damper acts per direction or along its axis. <c>springs.NAME.stiffness</c>
/// then varies the spring's scale (its largest translational stiffness, or its axial stiffness) and multiplies every
/// component, rotations included, by the same factor; <c>springs.NAME.stiffness.z</c> and
/// <c>springs.NAME.rotational-stiffness.rx</c> vary one component and keep the others; <c>springs.NAME.axial</c> names
/// an axial spring's stiffness. Dampers alike with <c>coefficient</c>, <c>rotational-coefficient</c> and <c>axial</c>.
/// <c>bodies.NAME.mass</c> varies a rigid body's mass and keeps its inertia matrix and centre of mass. Inerters take
/// the springs' forms with <c>inertance</c>, <c>rotational-inertance</c> and <c>axial</c>.</para>
/// <para><c>transducers.NAME.force-factor</c> varies a transducer's Bl (line models; always above zero): the lever
/// between the mechanical pair and the electrical branch, so the branch's capacitances and inductances reach M and K
/// through Bl² (see <see cref="Transducer"/>).</para>
/// </remarks>
public sealed record ParameterPath(ParameterKind Kind, string Element)
{
    /// <summary>The one direction varied of a per-direction spring or damper; null for the whole element.</summary>
    public Direction? Component { get; init; }

    /// <summary>True when the path was written with the field <c>axial</c> (an axial spring or damper).</summary>
    public bool Axial { get; init; }

    private static readonly (string Section, string Field, ParameterKind Kind, string[] OtherFields)[] Sections =
    [
        ("masses", "mass", ParameterKind.Mass, ["at", "directions"]),
        ("bodies", "mass", ParameterKind.BodyMass, ["centre-of-mass", "inertia", "principal-inertia", "box", "points"]),
        ("springs", "stiffness", ParameterKind.Stiffness, ["between"]),
        ("dampers", "coefficient", ParameterKind.DamperCoefficient, ["between"]),
        ("inerters", "inertance", ParameterKind.Inertance, ["between"]),
        ("transducers", "force-factor", ParameterKind.ForceFactor, ["between", "branch"]),
    ];

    private string Section => Sections.First(s => s.Kind == Kind).Section;

    private string Field => Sections.First(s => s.Kind == Kind).Field;

    /// <summary>The path as written, e.g. "springs.columns.stiffness" or "springs.mount-1.stiffness.z".</summary>
    public string Text => Component is { } d
        ? $"{Section}.{Element}.{(d.IsRotation() ? "rotational-" + Field : Field)}.{d.Label()}"
        : $"{Section}.{Element}.{(Axial ? "axial" : Field)}";

    /// <summary>The physical quantity of the field (its SI unit is the value's unit).</summary>
    public Quantity Quantity => (Kind, Component?.IsRotation() == true) switch
    {
        (ParameterKind.Mass or ParameterKind.BodyMass, _) => Quantity.Mass,
        (ParameterKind.Inertance, false) => Quantity.Mass,
        (ParameterKind.Inertance, true) => Quantity.MomentOfInertia,
        (ParameterKind.ForceFactor, _) => Quantity.ForceFactor,
        (ParameterKind.Stiffness, false) => Quantity.Stiffness,
        (ParameterKind.Stiffness, true) => Quantity.RotationalStiffness,
        (_, false) => Quantity.Damping,
        _ => Quantity.RotationalDamping,
    };

    /// <summary>The field's value in <paramref name="network"/>, SI.</summary>
    public double Get(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        return Kind switch
        {
            ParameterKind.Mass => network.Masses.First(m => m.Name == Element).Kilograms,
            ParameterKind.BodyMass => network.Bodies.First(b => b.Name == Element).Kilograms,
            ParameterKind.Stiffness when Component is { } d => network.Springs.First(s => s.Name == Element).Components.First(c => c.Direction == d).Value,
            ParameterKind.Stiffness => network.Springs.First(s => s.Name == Element).Stiffness,
            ParameterKind.Inertance when Component is { } d => network.Inerters.First(b => b.Name == Element).Components.First(c => c.Direction == d).Value,
            ParameterKind.Inertance => network.Inerters.First(b => b.Name == Element).Inertance,
            ParameterKind.ForceFactor => network.Transducers.First(t => t.Name == Element).ForceFactor,
            _ when Component is { } d => network.Dampers.First(x => x.Name == Element).Components.First(c => c.Direction == d).Value,
            _ => network.Dampers.First(d => d.Name == Element).Coefficient,
        };
    }

    /// <summary>A copy of <paramref name="network"/> with the field set to <paramref name="value"/> (SI).</summary>
    /// <remarks>Without <see cref="Component"/>, a per-direction spring or damper has all its components scaled in proportion (see the remarks of the type).</remarks>
    public Network Apply(Network network, double value) => Kind switch
    {
        ParameterKind.Mass => network.WithMassValue(Element, value),
        ParameterKind.BodyMass => network.WithBodyMass(Element, value),
        ParameterKind.Stiffness when Component is { } d => network.WithSpringComponent(Element, d, value),
        ParameterKind.Stiffness => network.WithSpringStiffness(Element, value),
        ParameterKind.Inertance when Component is { } d => network.WithInerterComponent(Element, d, value),
        ParameterKind.Inertance => network.WithInerterInertance(Element, value),
        ParameterKind.ForceFactor => network.WithTransducerForceFactor(Element, value),
        _ when Component is { } d => network.WithDamperComponent(Element, d, value),
        _ => network.WithDamperCoefficient(Element, value),
    };

    /// <summary>Whether <paramref name="value"/> (SI) is a value the field can take: positive for a mass or a force factor, non-negative otherwise.</summary>
    /// <remarks>
    /// The plausible ranges of the model format (docs/model-format.md): mass 1 mg to 1,000,000 t, stiffness 0 to
    /// 1e14 N/m (rotational: N·m/rad), damping 0 to 1e13 N·s/m (rotational: N·m·s/rad), inertance 0 to 1e9 kg
    /// (rotational: 0 to 1e12 kg·m²/rad), force factor above 0 up to 1e6 T·m. Outside them the eigen solve overflows
    /// (a study from 1e308 N/m crashed).
    /// </remarks>
    public bool Admits(double value) => double.IsFinite(value) && value >= Minimum && value <= Maximum && (!MinimumExcluded || value > Minimum);

    /// <summary>The smallest value admitted, SI (itself excluded when <see cref="MinimumExcluded"/>).</summary>
    public double Minimum => Kind is ParameterKind.Mass or ParameterKind.BodyMass ? 1e-6 : 0;

    /// <summary>
    /// True when <see cref="Minimum"/> itself is not admitted: a force factor must be above zero, and so must the
    /// inertance of an inerter with an end on a massless node (<see cref="MasslessEnd"/>).
    /// </summary>
    public bool MinimumExcluded => Kind == ParameterKind.ForceFactor || MasslessEnd is not null;

    /// <summary>
    /// For an inertance: the massless node at one of the inerter's ends, or null. At zero inertance that node would lose
    /// its only inertia and change from a moving coordinate to a condensed one part-way through the study, so a study
    /// of such an inertance stays above zero.
    /// </summary>
    public string? MasslessEnd { get; init; }

    /// <summary>The largest value admitted, SI.</summary>
    public double Maximum => (Kind, Component?.IsRotation() == true) switch
    {
        (ParameterKind.Mass or ParameterKind.BodyMass, _) => 1e9,
        (ParameterKind.Stiffness, _) => 1e14,
        (ParameterKind.Inertance, false) => 1e9,
        (ParameterKind.Inertance, true) => 1e12,
        (ParameterKind.ForceFactor, _) => 1e6,
        _ => 1e13,
    };

    /// <summary>Reads <paramref name="text"/> against <paramref name="network"/>; on failure <paramref name="error"/> says what is wrong and what exists.</summary>
    public static ParameterPath? Resolve(string text, Network network, out string? error)
    {
        ArgumentNullException.ThrowIfNull(network);
        error = null;
        var parts = (text ?? "").Split('.');
        var sections = Sections.Where(s => s.Kind switch
        {
            ParameterKind.BodyMass => network.Space != ModelSpace.Line,
            ParameterKind.ForceFactor => network.Space == ModelSpace.Line,
            _ => true,
        }).ToArray();
        var known = string.Join(", ", sections.Select(s => $"{s.Section}.NAME.{s.Field}"))
                    + (network.Space == ModelSpace.Line ? "" : " (springs, dampers and inerters also per direction: springs.NAME.stiffness.z)");
        if (parts.Length < 3 || parts.Any(p => p.Length == 0))
        {
            error = $"'{text}' is not a parameter path; write section.name.field, one of: {known}";
            return null;
        }
        var section = sections.FirstOrDefault(s => s.Section == parts[0]);
        if (section.Section is null)
        {
            error = parts[0] switch
            {
                "bodies" => $"a line model has no bodies, so '{text}' names nothing; use one of: {known}",
                "transducers" => $"a {(network.Space == ModelSpace.Plane ? "plane" : "3d")} model has no transducers (line models only), so '{text}' names nothing; use one of: {known}",
                _ => $"'{parts[0]}' is not a section that holds numeric fields; use one of: {known}",
            };
            return null;
        }
        var names = (section.Kind switch
        {
            ParameterKind.Mass => network.Masses.Select(m => m.Name),
            ParameterKind.BodyMass => network.Bodies.Select(b => b.Name),
            ParameterKind.Stiffness => network.Springs.Select(s => s.Name),
            ParameterKind.Inertance => network.Inerters.Select(i => i.Name),
            ParameterKind.ForceFactor => network.Transducers.Select(t => t.Name),
            _ => network.Dampers.Select(d => d.Name),
        }).ToList();

        // Names may hold dots: read "name.field" first, then "name.field.direction" when that names an element instead.
        var name = string.Join('.', parts[1..^1]);
        var field = parts[^1];
        string? direction = null;
        if (!names.Contains(name) && parts.Length >= 4 && names.Contains(string.Join('.', parts[1..^2])))
        {
            name = string.Join('.', parts[1..^2]);
            field = parts[^2];
            direction = parts[^1];
        }
        if (!names.Contains(name))
        {
            error = names.Count == 0
                ? $"the model has no {section.Section}, so '{text}' names nothing"
                : $"the model has no entry '{name}' under '{section.Section}' (it has: {string.Join(", ", names)})";
            return null;
        }
        if (section.Kind is ParameterKind.Stiffness or ParameterKind.DamperCoefficient && network.Space != ModelSpace.Line)
            return ResolveDirectional(text!, network, section.Section, section.Kind, name, field, direction, out error);
        if (section.Kind == ParameterKind.Inertance)
        {
            var inerter = network.Inerters.First(i => i.Name == name);
            var massless = new[] { inerter.NodeA, inerter.NodeB }
                .FirstOrDefault(n => network.Masses.Any(m => m.Name == n && m.Kilograms == 0));
            var path = section.Kind == ParameterKind.Inertance && network.Space != ModelSpace.Line
                ? ResolveDirectional(text!, network, section.Section, section.Kind, name, field, direction, out error)
                : field == section.Field && direction is null ? new ParameterPath(section.Kind, name) : null;
            if (path is not null) return path with { MasslessEnd = massless };
            if (error is not null) return null;
        }
        if (field != section.Field || direction is not null)
        {
            error = section.OtherFields.Contains(field) && direction is null
                ? $"'{field}' of {section.Section} is not a numeric field; the numeric field is '{section.Field}' ({section.Section}.{name}.{section.Field})"
                : $"{section.Section} have no field '{(direction is null ? field : field + "." + direction)}'; the numeric field is '{section.Field}' ({section.Section}.{name}.{section.Field})";
            return null;
        }
        return new ParameterPath(section.Kind, name);
    }

    /// <summary>A spring's, damper's or inerter's field in a plane or 3d model: the scale, one direction, or the axial value.</summary>
    private static ParameterPath? ResolveDirectional(string text, Network network, string section, ParameterKind kind, string name,
        string field, string? directionLabel, out string? error)
    {
        error = null;
        var (valueKey, rotationKey, element) = kind switch
        {
            ParameterKind.Stiffness => ("stiffness", "rotational-stiffness", "spring"),
            ParameterKind.Inertance => ("inertance", "rotational-inertance", "inerter"),
            _ => ("coefficient", "rotational-coefficient", "damper"),
        };
        var (axial, scale, components) = kind switch
        {
            ParameterKind.Stiffness => network.Springs.Where(s => s.Name == name).Select(s => (s.Axial, s.Stiffness, s.Components)).First(),
            ParameterKind.Inertance => network.Inerters.Where(i => i.Name == name).Select(i => (i.Axial, i.Inertance, i.Components)).First(),
            _ => network.Dampers.Where(d => d.Name == name).Select(d => (d.Axial, d.Coefficient, d.Components)).First(),
        };
        var fields = Fields(section, name, valueKey, rotationKey, axial, scale, components);
        string Offer() => $"{element} '{name}' has: {string.Join(", ", fields)}";

        if (directionLabel is null)
        {
            if (field == "axial" && axial) return new ParameterPath(kind, name) { Axial = true };
            if (field == valueKey && (axial || scale > 0)) return new ParameterPath(kind, name);
            error = field == "between"
                ? $"'between' of {section} is not a numeric field; {Offer()}"
                : field == valueKey
                    ? $"{element} '{name}' has no translational {valueKey} above zero, so '{text}' has nothing to scale; vary one direction instead ({Offer()})"
                    : field == "axial"
                        ? $"{element} '{name}' is not axial (it acts per direction), so '{text}' names nothing; {Offer()}"
                        : $"{section} have no field '{field}'; {Offer()}";
            return null;
        }
        var direction = Directions.Parse(directionLabel);
        if ((field != valueKey && field != rotationKey) || direction is null || direction.Value.IsRotation() != (field == rotationKey))
        {
            error = field == valueKey || field == rotationKey
                ? $"'{directionLabel}' is not a {(field == valueKey ? "translation (x, y, z)" : "rotation (rx, ry, rz)")}, so '{text}' names nothing; {Offer()}"
                : $"{section} have no field '{field}.{directionLabel}'; {Offer()}";
            return null;
        }
        if (axial || !components.Any(c => c.Direction == direction))
        {
            error = axial
                ? $"{element} '{name}' is axial (it acts along the line between its ends), so it has no per-direction value; {Offer()}"
                : $"{element} '{name}' has no {field} in '{directionLabel}'; {Offer()}";
            return null;
        }
        return new ParameterPath(kind, name) { Component = direction };
    }

    /// <summary>The paths that name a numeric field of one spring, damper or inerter of a plane or 3d model.</summary>
    private static ImmutableArray<string> Fields(string section, string name, string valueKey, string rotationKey, bool axial, double scale,
        ImmutableArray<DirectionalValue> components)
    {
        if (axial) return [$"{section}.{name}.axial", $"{section}.{name}.{valueKey} (the same)"];
        var list = new List<string>();
        if (scale > 0) list.Add($"{section}.{name}.{valueKey} (every direction in proportion)");
        list.AddRange(components.Select(c => $"{section}.{name}.{(c.Direction.IsRotation() ? rotationKey : valueKey)}.{c.Direction.Label()}"));
        return [.. list];
    }
}
