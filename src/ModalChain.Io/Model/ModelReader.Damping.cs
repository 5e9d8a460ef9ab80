using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Yaml;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    private static readonly Range RayleighFrequencyRange = new(0, 1e5, MinimumInclusive: false); // Hz

    /// <summary>Reads 'damping': modal ratios, Rayleigh damping and a loss factor, added to the discrete dampers.</summary>
    private static DampingModel ReadDamping(YMapping top, ReadContext context)
    {
        if (top["damping"] is not { } node || node is YScalar { IsPlainNull: true }) return DampingModel.None;
        if (context.Mapping(node, "'damping'") is not { } damping) return DampingModel.None;
        context.RejectUnknownKeys(damping, "'damping'", "modal", "rayleigh", "loss-factor");
        context.Positions["damping"] = damping.Position;

        ImmutableArray<double> modal = [];
        if (damping["modal"] is { } modalNode)
        {
            var items = modalNode is YSequence seq ? seq.Items : [modalNode];
            if (items.Length == 0) context.Error(modalNode, "'modal' of 'damping' lists no ratio; write e.g. 'modal: 2 %' or 'modal: [2 %, 3 %]'");
            var ratios = ImmutableArray.CreateBuilder<double>();
            foreach (var item in items)
                if (DampingRatio(item, "'modal' of 'damping'", context) is { } z) ratios.Add(z);
            modal = ratios.ToImmutable();
        }

        RayleighDamping? rayleigh = null;
        if (damping["rayleigh"] is { } rayleighNode && context.Mapping(rayleighNode, "'rayleigh' of 'damping'") is { } r)
        {
            const string what = "'rayleigh' of 'damping'";
            context.RejectUnknownKeys(r, what, "ratio", "at", "mass", "stiffness");
            var byTargets = r["ratio"] is not null || r["at"] is not null;
            var byCoefficients = r["mass"] is not null || r["stiffness"] is not null;
            if (byTargets && byCoefficients)
                context.Error(r, $"{what} takes either 'ratio' and 'at' (two target frequencies) or 'mass' and 'stiffness' (a0, a1), not both");
            else if (byTargets)
            {
                var ratio = r["ratio"] is { } rn ? DampingRatio(rn, $"'ratio' of {what}", context) : Missing(r, what, "ratio", context);
                double? f1 = null, f2 = null;
                if (r["at"] is not { } atNode) context.Error(r, $"{what} needs 'at: [f1, f2]', the two frequencies where the ratio holds");
                else if (atNode is not YSequence { Items.Length: 2 } at) context.Error(atNode, $"'at' of {what} must list exactly two frequencies, e.g. [4 Hz, 30 Hz]");
                else
                {
                    f1 = context.Value(at.Items[0], Quantity.Frequency, RayleighFrequencyRange, $"'at' of {what}");
                    f2 = context.Value(at.Items[1], Quantity.Frequency, RayleighFrequencyRange, $"'at' of {what}");
                    if (f1 is { } a && f2 is { } b && a == b)
                    {
                        context.Error(at, $"the two frequencies of 'at' of {what} must differ");
                        f1 = null;
                    }
                }
                if (ratio is { } z && f1 is { } w1 && f2 is { } w2)
                    rayleigh = RayleighDamping.FromTargets(z, 2 * Math.PI * w1, 2 * Math.PI * w2);
            }
            else if (byCoefficients)
            {
                var a0 = r["mass"] is { } mn ? Coefficient(mn, "1/s", $"'mass' (a0, in 1/s) of {what}", context) : 0;
                var a1 = r["stiffness"] is { } sn ? Coefficient(sn, "s", $"'stiffness' (a1, in s) of {what}", context) : 0;
                if (a0 is { } x0 && a1 is { } x1) rayleigh = new RayleighDamping(x0, x1);
            }
            else context.Error(r, $"{what} needs 'ratio' and 'at', or 'mass' and 'stiffness'");
        }

        if (!modal.IsEmpty && damping["rayleigh"] is not null)
            context.Error(damping["rayleigh"]!, "'damping' takes 'modal' or 'rayleigh', not both: each describes the damping of every mode");

        var eta = 0.0;
        if (damping["loss-factor"] is { } etaNode && context.Value(etaNode, Quantity.Ratio, Range.Any, "'loss-factor' of 'damping'") is { } e)
        {
            if (e < 0) context.Error(etaNode, $"'loss-factor' of 'damping' is {Format(e)}; a loss factor cannot be negative");
            else if (e > 2) context.Error(etaNode, $"'loss-factor' of 'damping' is {Format(e)}; structural loss factors are below about 0.2 — check the value");
            else eta = e;
        }
        return new DampingModel(modal, rayleigh, eta);
    }

    private static double? Missing(YMapping mapping, string what, string key, ReadContext context)
    {
        context.Error(mapping, $"{what} needs '{key}'");
        return null;
    }

    /// <summary>A damping ratio in [0, 1): "2 %" or 0.02.</summary>
    private static double? DampingRatio(YNode node, string what, ReadContext context)
    {
        if (context.Value(node, Quantity.Ratio, Range.Any, what) is not { } z) return null;
        if (z < 0)
        {
            context.Error(node, $"{what} is {Format(z)}; a damping ratio cannot be negative");
            return null;
        }
        if (z >= 1)
        {
            context.Error(node, $"{what} is {Format(z)} (critical damping or more); structures are damped well below 100 % — write e.g. '2 %'");
            return null;
        }
        return z;
    }

    /// <summary>A non-negative coefficient written as a plain number or with its one accepted unit symbol.</summary>
    private static double? Coefficient(YNode node, string unit, string what, ReadContext context)
    {
        if (node is not YScalar s || s.IsPlainNull)
        {
            context.Error(node, $"{what} must be a number");
            return null;
        }
        var text = s.Value.Trim();
        if (text.EndsWith(unit, StringComparison.Ordinal)) text = text[..^unit.Length].Trim();
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var v) || !double.IsFinite(v))
        {
            context.Error(node, $"{what}: '{s.Value}' is not a number (write it plain, in {unit})");
            return null;
        }
        if (v < 0)
        {
            context.Error(node, $"{what} is {Format(v)}; a Rayleigh coefficient cannot be negative");
            return null;
        }
        return v;
    }

    private static string Format(double v) => v.ToString("G6", CultureInfo.InvariantCulture);
}
