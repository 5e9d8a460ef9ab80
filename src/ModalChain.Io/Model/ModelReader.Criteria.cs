using System.Collections.Immutable;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Units;
using ModalChain.Io.Yaml;
using CoreNetwork = ModalChain.Core.Model.Network;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    private static readonly Range MarginRange = new(0, 0.95, MinimumInclusive: false);
    // Hz; 0.001 Hz (0.06 rpm) is slower than any machine, and a speed of 1e-320 rpm printed an infinite separation.
    private static readonly Range SeparationSpeedRange = new(1e-3, 1e5);
    private static readonly Range OrderRange = new(0, 1000, MinimumInclusive: false);
    private static readonly Range LimitRange = new(0, 1e6, MinimumInclusive: false);

    /// <summary>Reads the optional <c>criteria:</c> section; <paramref name="network"/> is null when the network had errors.</summary>
    private static CriteriaSet ReadCriteria(YMapping top, ReadContext context, CoreNetwork? network)
    {
        if (top["criteria"] is not { } node || node is YScalar { IsPlainNull: true }) return CriteriaSet.None;
        if (context.Mapping(node, "'criteria'") is not { } criteria) return CriteriaSet.None;
        context.RejectUnknownKeys(criteria, "'criteria'", "separation", "limits");
        context.Positions["criteria"] = criteria.Position;

        SeparationCriterion? separation = null;
        if (criteria["separation"] is { } sepNode && context.Mapping(sepNode, "'separation' of 'criteria'") is { } sep)
        {
            context.Positions["criteria.separation"] = sep.Position;
            const string what = "the separation criterion";
            context.RejectUnknownKeys(sep, what, "margin", "speeds", "orders");
            var margin = sep["margin"] is { } marginNode ? ReadMargin(marginNode, what, context) : SeparationCriterion.DefaultMargin;
            var speeds = sep["speeds"] is { } speedsNode
                ? ReadList(speedsNode, Quantity.Frequency, SeparationSpeedRange, $"'speeds' of {what}", context)
                : MissingCriterion(sep, $"{what} needs 'speeds', the running speeds to keep clear of, e.g. [1480 rpm]", context);
            var orders = sep["orders"] is { } ordersNode
                ? ReadList(ordersNode, Quantity.Ratio, OrderRange, $"'orders' of {what}", context)
                : [1.0];
            if (margin is { } m && speeds is { } s && orders is { } o) separation = new SeparationCriterion(m, s, o);
        }

        var limits = ImmutableArray.CreateBuilder<VibrationLimit>();
        if (criteria["limits"] is { } limitsNode && !(limitsNode is YScalar { IsPlainNull: true }))
        {
            if (limitsNode is not YSequence list)
                context.Error(limitsNode, "'limits' of 'criteria' must be a list of {at, quantity, peak|rms} entries");
            else
                for (var i = 0; i < list.Items.Length; i++)
                    if (ReadLimit(list.Items[i], i + 1, context, network) is { } limit)
                    {
                        context.Positions[$"criteria.limits[{i}]"] = list.Items[i].Position;
                        limits.Add(limit);
                    }
        }
        return new CriteriaSet(separation, limits.ToImmutable());
    }

    private static double? ReadMargin(YNode node, string what, ReadContext context)
    {
        if (context.Value(node, Quantity.Ratio, Range.Any, $"'margin' of {what}") is not { } m) return null;
        if (m > MarginRange.Minimum && m <= MarginRange.Maximum) return m;
        context.Error(node, string.Create(System.Globalization.CultureInfo.InvariantCulture,
            $"'margin' of {what} is {m * 100:G4} %; it must be above 0 % and at most {MarginRange.Maximum * 100:G3} % (20 % is usual)"));
        return null;
    }

    private static VibrationLimit? ReadLimit(YNode node, int number, ReadContext context, CoreNetwork? network)
    {
        var what = $"limit {number} of 'criteria'";
        if (context.Mapping(node, what) is not { } entry) return null;
        context.RejectUnknownKeys(entry, what, "at", "quantity", "peak", "rms");

        string? at = null;
        if (entry["at"] is not { } atNode) context.Error(entry, $"{what} needs 'at', the mass whose vibration it limits");
        else if (context.Text(atNode, $"'at' of {what}") is { } name)
        {
            if (network is not null && !network.IsMass(name))
                context.Error(atNode, $"{what} is at '{name}', which is not a mass of the model{ReadContext.Suggest(name, network.Masses.Select(m => m.Name))}");
            else at = name;
        }

        ResponseQuantity? quantity = null;
        if (entry["quantity"] is not { } qNode) context.Error(entry, $"{what} needs 'quantity': displacement, velocity or acceleration");
        else if (context.Text(qNode, $"'quantity' of {what}") is { } q)
        {
            quantity = q switch
            {
                "displacement" => ResponseQuantity.Displacement,
                "velocity" => ResponseQuantity.Velocity,
                "acceleration" => ResponseQuantity.Acceleration,
                _ => null,
            };
            if (quantity is null)
                context.Error(qNode, $"'quantity' of {what} is '{q}'{ReadContext.Suggest(q, ["displacement", "velocity", "acceleration"])}; use displacement, velocity or acceleration");
        }

        var peak = entry["peak"];
        var rms = entry["rms"];
        if (peak is not null && rms is not null)
        {
            context.Error(rms, $"{what} gives both 'peak' and 'rms'; a limit bounds one of them (write two limits for both)");
            return null;
        }
        if (peak is null && rms is null)
        {
            context.Error(entry, $"{what} needs 'peak' or 'rms', the limiting amplitude with its unit, e.g. 'peak: 4 mm/s'");
            return null;
        }
        if (quantity is not { } kind) return null;
        var unitQuantity = kind switch
        {
            ResponseQuantity.Displacement => Quantity.Length,
            ResponseQuantity.Velocity => Quantity.Velocity,
            _ => Quantity.Acceleration,
        };
        var measure = peak is not null ? AmplitudeMeasure.Peak : AmplitudeMeasure.Rms;
        var value = context.Value(peak ?? rms!, unitQuantity, LimitRange, $"'{(peak is not null ? "peak" : "rms")}' of {what}");
        return at is not null && value is { } v ? new VibrationLimit(at, kind, measure, v) : null;
    }

    /// <summary>A list (or a single value) of <paramref name="quantity"/>; null when any item is wrong or it is empty.</summary>
    private static ImmutableArray<double>? ReadList(YNode node, Quantity quantity, Range range, string what, ReadContext context)
    {
        IEnumerable<YNode> items = node is YSequence seq ? seq.Items : [node];
        if (node is YSequence { Items.Length: 0 })
        {
            context.Error(node, $"{what} is empty; give at least one value");
            return null;
        }
        var values = items.Select(item => context.Value(item, quantity, range, what)).ToArray();
        return values.All(v => v is not null) ? [.. values.Select(v => v!.Value)] : null;
    }

    private static ImmutableArray<double>? MissingCriterion(YMapping at, string message, ReadContext context)
    {
        context.Error(at, message);
        return null;
    }
}
