using ModalChain.Core.Model;
using ModalChain.Core.Units;

namespace ModalChain.Core.Analyses.Studies;

/// <summary>Which numeric field of which element a study varies.</summary>
public enum ParameterKind
{
    /// <summary>masses.NAME.mass, kg.</summary>
    Mass,
    /// <summary>springs.NAME.stiffness, N/m.</summary>
    Stiffness,
    /// <summary>dampers.NAME.coefficient, N·s/m.</summary>
    DamperCoefficient,
}

/// <summary>A numeric field of a network addressed as in the model file: <c>section.name.field</c>.</summary>
/// <param name="Kind">What the field is.</param>
/// <param name="Element">The element's name.</param>
public sealed record ParameterPath(ParameterKind Kind, string Element)
{
    private static readonly (string Section, string Field, ParameterKind Kind, string[] OtherFields)[] Sections =
    [
        ("masses", "mass", ParameterKind.Mass, ["at"]),
        ("springs", "stiffness", ParameterKind.Stiffness, ["between"]),
        ("dampers", "coefficient", ParameterKind.DamperCoefficient, ["between"]),
    ];

    /// <summary>The path as written, e.g. "springs.columns.stiffness".</summary>
    public string Text => Kind switch
    {
        ParameterKind.Mass => $"masses.{Element}.mass",
        ParameterKind.Stiffness => $"springs.{Element}.stiffness",
        _ => $"dampers.{Element}.coefficient",
    };

    /// <summary>The physical quantity of the field (its SI unit is the value's unit).</summary>
    public Quantity Quantity => Kind switch
    {
        ParameterKind.Mass => Quantity.Mass,
        ParameterKind.Stiffness => Quantity.Stiffness,
        _ => Quantity.Damping,
    };

    /// <summary>The field's value in <paramref name="network"/>, SI.</summary>
    public double Get(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        return Kind switch
        {
            ParameterKind.Mass => network.Masses.First(m => m.Name == Element).Kilograms,
            ParameterKind.Stiffness => network.Springs.First(s => s.Name == Element).Stiffness,
            _ => network.Dampers.First(d => d.Name == Element).Coefficient,
        };
    }

    /// <summary>A copy of <paramref name="network"/> with the field set to <paramref name="value"/> (SI).</summary>
    public Network Apply(Network network, double value) => Kind switch
    {
        ParameterKind.Mass => network.WithMassValue(Element, value),
        ParameterKind.Stiffness => network.WithSpringStiffness(Element, value),
        _ => network.WithDamperCoefficient(Element, value),
    };

    /// <summary>Whether <paramref name="value"/> (SI) is a value the field can take: positive for a mass, non-negative otherwise.</summary>
    /// <remarks>
    /// The plausible ranges of the model format (docs/model-format.md): mass 1 mg to 1,000,000 t, stiffness 0 to
    /// 1e14 N/m, damping 0 to 1e13 N·s/m. Outside them the eigen solve overflows (a study from 1e308 N/m crashed).
    /// </remarks>
    public bool Admits(double value) => double.IsFinite(value) && value >= Minimum && value <= Maximum;

    /// <summary>The smallest value admitted, SI.</summary>
    public double Minimum => Kind == ParameterKind.Mass ? 1e-6 : 0;

    /// <summary>The largest value admitted, SI.</summary>
    public double Maximum => Kind switch { ParameterKind.Mass => 1e9, ParameterKind.Stiffness => 1e14, _ => 1e13 };

    /// <summary>Reads <paramref name="text"/> against <paramref name="network"/>; on failure <paramref name="error"/> says what is wrong and what exists.</summary>
    public static ParameterPath? Resolve(string text, Network network, out string? error)
    {
        ArgumentNullException.ThrowIfNull(network);
        error = null;
        var parts = (text ?? "").Split('.');
        var known = string.Join(", ", Sections.Select(s => $"{s.Section}.NAME.{s.Field}"));
        if (parts.Length < 3 || parts.Any(p => p.Length == 0))
        {
            error = $"'{text}' is not a parameter path; write section.name.field, one of: {known}";
            return null;
        }
        var section = Sections.FirstOrDefault(s => s.Section == parts[0]);
        if (section.Section is null)
        {
            error = $"'{parts[0]}' is not a section that holds numeric fields; use one of: {known}";
            return null;
        }
        var name = string.Join('.', parts[1..^1]);
        var field = parts[^1];
        var names = section.Kind switch
        {
            ParameterKind.Mass => network.Masses.Select(m => m.Name),
            ParameterKind.Stiffness => network.Springs.Select(s => s.Name),
            _ => network.Dampers.Select(d => d.Name),
        };
        var list = names.ToList();
        if (!list.Contains(name))
        {
            error = list.Count == 0
                ? $"the model has no {section.Section}, so '{text}' names nothing"
                : $"the model has no entry '{name}' under '{section.Section}' (it has: {string.Join(", ", list)})";
            return null;
        }
        if (field != section.Field)
        {
            error = section.OtherFields.Contains(field)
                ? $"'{field}' of {section.Section} is not a numeric field; the numeric field is '{section.Field}' ({section.Section}.{name}.{section.Field})"
                : $"{section.Section} have no field '{field}'; the numeric field is '{section.Field}' ({section.Section}.{name}.{section.Field})";
            return null;
        }
        return new ParameterPath(section.Kind, name);
    }
}
