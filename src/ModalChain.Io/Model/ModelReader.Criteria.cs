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
        context.RejectUnknownKeys(criteria, "'criteria'", "separation", "limits", "machine-zones", "floor-curves");
        context.Positions["criteria"] = criteria.Position;

        SeparationCriterion? separation = null;
        if (criteria["separation"] is { } sepNode && context.Mapping(sepNode, "'separation' of 'criteria'") is { } sep)
        {
            context.Positions["criteria.separation"] = sep.Position;
            const string what = "the separation criterion";
            context.RejectUnknownKeys(sep, what, "margin", "speeds", "orders", "exempt");
            var margin = sep["margin"] is { } marginNode ? ReadMargin(marginNode, what, context) : SeparationCriterion.DefaultMargin;
            var speeds = sep["speeds"] is { } speedsNode
                ? ReadList(speedsNode, Quantity.Frequency, SeparationSpeedRange, $"'speeds' of {what}", context)
                : MissingCriterion(sep, $"{what} needs 'speeds', the running speeds to keep clear of, e.g. [1480 rpm]", context);
            var orders = sep["orders"] is { } ordersNode
                ? ReadList(ordersNode, Quantity.Ratio, OrderRange, $"'orders' of {what}", context)
                : [1.0];
            var exempt = sep["exempt"] is { } exemptNode && !(exemptNode is YScalar { IsPlainNull: true })
                ? ReadExempt(exemptNode, $"'exempt' of {what}", context, network)
                : [];
            if (margin is { } m && speeds is { } s && orders is { } o && exempt is { } x)
                separation = new SeparationCriterion(m, s, o) { Exempt = x };
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
        return new CriteriaSet(separation, limits.ToImmutable())
        {
            Zones = ReadNamedList(criteria, "machine-zones", "{at, class, zone}", ReadMachineZone, context, network),
            Floors = ReadNamedList(criteria, "floor-curves", "{at, curve}", ReadFloorCurve, context, network),
        };
    }

    private static ImmutableArray<T> ReadNamedList<T>(
        YMapping criteria, string key, string shape, Func<YMapping, string, ReadContext, CoreNetwork?, T?> read, ReadContext context, CoreNetwork? network)
        where T : class
    {
        var result = ImmutableArray.CreateBuilder<T>();
        if (criteria[key] is not { } node || node is YScalar { IsPlainNull: true }) return result.ToImmutable();
        if (node is not YSequence list)
        {
            context.Error(node, $"'{key}' of 'criteria' must be a list of {shape} entries");
            return result.ToImmutable();
        }
        for (var i = 0; i < list.Items.Length; i++)
        {
            var what = $"entry {i + 1} of '{key}'";
            if (context.Mapping(list.Items[i], what) is not { } entry) continue;
            if (read(entry, what, context, network) is { } item)
            {
                context.Positions[$"criteria.{key}[{i}]"] = entry.Position;
                result.Add(item);
            }
        }
        return result.ToImmutable();
    }

    private static MachineZoneCriterion? ReadMachineZone(YMapping entry, string what, ReadContext context, CoreNetwork? network)
    {
        context.RejectUnknownKeys(entry, what, "at", "class", "zone");
        var at = ReadMasses(entry, what, "the masses whose r.m.s. velocity is classified", context, network);
        MachineZoneClass? machineClass = null;
        var names = PublishedLevels.MachineClasses.Select(c => c.Name).ToArray();
        if (entry["class"] is not { } classNode)
            context.Error(entry, $"{what} needs 'class', the machine class whose zone boundaries apply: {string.Join(", ", names)}");
        else if (context.Text(classNode, $"'class' of {what}") is { } name)
        {
            machineClass = PublishedLevels.MachineClass(name);
            if (machineClass is null)
                context.Error(classNode, $"'class' of {what} is '{name}', which is not a known machine class{ReadContext.Suggest(name, names)}; use one of {string.Join(", ", names)}");
        }
        char? zone = null;
        if (entry["zone"] is not { } zoneNode)
            context.Error(entry, $"{what} needs 'zone', the worst zone accepted: A, B or C");
        else if (context.Text(zoneNode, $"'zone' of {what}") is { } z)
        {
            if (z.Length == 1 && "ABC".Contains(char.ToUpperInvariant(z[0]), StringComparison.Ordinal)) zone = char.ToUpperInvariant(z[0]);
            else context.Error(zoneNode, $"'zone' of {what} is '{z}'; give the worst zone accepted: A, B or C (zone D has no upper boundary)");
        }
        return at is { } masses && machineClass is not null && zone is { } accepted ? new MachineZoneCriterion(masses, machineClass, accepted) : null;
    }

    private static FloorCriterion? ReadFloorCurve(YMapping entry, string what, ReadContext context, CoreNetwork? network)
    {
        context.RejectUnknownKeys(entry, what, "at", "curve");
        var at = ReadMasses(entry, what, "the masses whose floor vibration is checked", context, network);
        FloorCurve? curve = null;
        var names = PublishedLevels.FloorCurves.Select(c => c.Name).ToArray();
        if (entry["curve"] is not { } curveNode)
            context.Error(entry, $"{what} needs 'curve', the vibration criterion curve: {string.Join(", ", names)}");
        else if (context.Text(curveNode, $"'curve' of {what}") is { } name)
        {
            curve = PublishedLevels.FloorCurve(name);
            if (curve is null)
                context.Error(curveNode, $"'curve' of {what} is '{name}', which is not a known curve{ReadContext.Suggest(name, names)}; use one of {string.Join(", ", names)}");
        }
        return at is { } masses && curve is not null ? new FloorCriterion(masses, curve) : null;
    }

    /// <summary>The 'at' of an entry: one mass name or a list of them; null when missing or any is wrong.</summary>
    private static ImmutableArray<string>? ReadMasses(YMapping entry, string what, string purpose, ReadContext context, CoreNetwork? network)
    {
        if (entry["at"] is not { } atNode)
        {
            context.Error(entry, $"{what} needs 'at', {purpose}");
            return null;
        }
        if (atNode is YSequence { Items.Length: 0 })
        {
            context.Error(atNode, $"'at' of {what} is empty; name at least one mass");
            return null;
        }
        IEnumerable<YNode> items = atNode is YSequence seq ? seq.Items : [atNode];
        var names = new List<string>();
        var ok = true;
        foreach (var item in items)
        {
            if (context.Text(item, $"'at' of {what}") is not { } name) { ok = false; continue; }
            if (!Measurable(item, name, what, context, network)) ok = false;
            else names.Add(name);
        }
        return ok ? [.. names] : null;
    }

    /// <summary>
    /// True when a criterion can measure at <paramref name="name"/> (or the network is unknown after errors): a mass in a
    /// line model; a mass, body or body point, bare or with a translation, in plane and 3d models
    /// (<see cref="MeasuringPoints"/>). Otherwise reports a located error and returns false.
    /// </summary>
    private static bool Measurable(YNode node, string name, string what, ReadContext context, CoreNetwork? network)
    {
        if (network is null) return true;
        if (network.IsElectrical(name))
        {
            // A circuit node's "motion" is its flux linkage and voltage: a vibration limit there would compare volts with m/s.
            context.Error(node, $"{what} is at '{name}', a node of the model's circuit (its velocity is a voltage in V): criteria limit the vibration of masses; name a mass of the structure");
            return false;
        }
        var points = new MeasuringPoints(network);
        if (points.Resolve(name, out var error, out var unknown) is not null) return true;
        var names = points.Names();
        if (network.Space != Core.Model.ModelSpace.Line)
            names = names.Concat(names.SelectMany(n => Core.Model.Directions.Translations(network.Space).Select(d => $"{n}.{Core.Model.Directions.Label(d)}"))).ToList();
        context.Error(node, $"{what} is at '{name}', which {error}{(unknown ? ReadContext.Suggest(name, names) : "")}");
        return false;
    }

    /// <summary>The masses whose modes the separation rule exempts: a name or a list of names, each a mass of the model, none twice.</summary>
    private static ImmutableArray<string>? ReadExempt(YNode node, string what, ReadContext context, CoreNetwork? network)
    {
        if (node is YMapping)
        {
            context.Error(node, $"{what} must be a list of mass names, e.g. [absorber]");
            return null;
        }
        IEnumerable<YNode> items = node is YSequence seq ? seq.Items : [node];
        var names = new List<string>();
        var ok = true;
        foreach (var item in items)
        {
            if (context.Text(item, what) is not { } name) { ok = false; continue; }
            if (network is not null && !network.IsMass(name))
            {
                context.Error(item, $"{what} names '{name}', which is not a mass of the model{ReadContext.Suggest(name, network.Masses.Select(m => m.Name))}; " +
                                    "name the absorber masses whose own modes are not to be checked");
                ok = false;
            }
            else if (names.Contains(name))
            {
                context.Error(item, $"{what} names '{name}' twice");
                ok = false;
            }
            else names.Add(name);
        }
        return ok ? [.. names] : null;
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
        else if (context.Text(atNode, $"'at' of {what}") is { } name && Measurable(atNode, name, what, context, network)) at = name;

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
