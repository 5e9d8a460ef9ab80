using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Yaml;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    private static readonly Range SweepFrequencyRange = new(0, 1e5, MinimumInclusive: false); // Hz
    /// <summary>The most points a sweep may have (a million points of JSON output took over 40 s).</summary>
    public const int MaxSweepPoints = 100_000;

    /// <summary>Reads 'harmonic': the loads, frequencies, outputs and method of a steady-state sweep.</summary>
    /// <remarks><paramref name="sources"/>: the names of a line model's circuit sources, loads named after them.</remarks>
    private static HarmonicSpec? ReadHarmonic(YMapping top, IReadOnlySet<string> masses, ImmutableArray<Load> loads, ReadContext context,
        IReadOnlyDictionary<string, bool>? sources = null)
    {
        if (top["harmonic"] is not { } node || node is YScalar { IsPlainNull: true }) return null;
        if (context.Mapping(node, "'harmonic'") is not { } h) return null;
        const string what = "'harmonic'";
        context.RejectUnknownKeys(h, what, "loads", "frequencies", "refine", "outputs", "method", "modes", "cases", "combine");
        context.Positions["harmonic"] = h.Position;
        var declaredLoads = (top["loads"] as YMapping)?.Entries.Select(e => e.Key.Value).ToImmutableHashSet() ?? [];
        if (sources is { Count: > 0 }) declaredLoads = declaredLoads.Union(sources.Keys);

        var loadNames = NameList(h, "loads", declaredLoads, "load", "'loads'", context);
        if (h["loads"] is YSequence named)
            foreach (var item in named.Items)
                if (item is YScalar { Value: var loadName } && (top["loads"] as YMapping)?[loadName] is YMapping timed && timed["time"] is not null)
                    context.Error(item, $"'loads' of 'harmonic' names '{loadName}', which has a 'time' function: it acts in transient runs only; give a load without 'time' for the sweep");
        if (h["loads"] is null && h["cases"] is null && declaredLoads.IsEmpty)
            context.Error(h, "'harmonic' needs loads to act, but the model has no 'loads' section");
        var outputs = NameList(h, "outputs", masses, "mass", "'masses'", context);

        FrequencySweep? sweep = null;
        if (h["frequencies"] is not { } fNode)
            context.Error(h, "'harmonic' needs 'frequencies': a range {from: 1 Hz, to: 60 Hz, points: 600} or a list [12 Hz, 24.7 Hz]");
        else if (fNode is YSequence list)
        {
            if (list.Items.Length == 0) context.Error(list, "'frequencies' of 'harmonic' lists no frequency");
            var values = list.Items.Select(i => context.Value(i, Quantity.Frequency, SweepFrequencyRange, "'frequencies' of 'harmonic'")).ToArray();
            if (values.Length > 0 && values.All(v => v is not null)) sweep = new FrequencyList([.. values.Select(v => v!.Value)]);
        }
        else if (context.Mapping(fNode, "'frequencies' of 'harmonic'") is { } range)
        {
            const string rw = "'frequencies' of 'harmonic'";
            context.RejectUnknownKeys(range, rw, "from", "to", "points", "spacing");
            var from = context.Required(range, "from", Quantity.Frequency, SweepFrequencyRange, rw);
            var to = context.Required(range, "to", Quantity.Frequency, SweepFrequencyRange, rw);
            if (from is { } a && to is { } b && !(b > a))
                context.Error(range["to"]!, $"'to' of {rw} ({Format(b)} Hz) must be above 'from' ({Format(a)} Hz)");
            var points = 200;
            if (range["points"] is { } pNode)
            {
                if (pNode is YScalar ps && int.TryParse(ps.Value, NumberStyles.None, CultureInfo.InvariantCulture, out var p) && p >= 2 && p <= MaxSweepPoints)
                    points = p;
                else
                {
                    context.Error(pNode, $"'points' of {rw} must be a whole number from 2 to {MaxSweepPoints}, found '{(pNode as YScalar)?.Value}'");
                    points = -1;
                }
            }
            var spacing = FrequencySpacing.Linear;
            if (range["spacing"] is { } sNode && context.Text(sNode, $"'spacing' of {rw}") is { } s)
            {
                if (s == "log") spacing = FrequencySpacing.Logarithmic;
                else if (s != "linear") context.Error(sNode, $"'spacing' of {rw} is '{s}'; write 'linear' or 'log'");
            }
            if (from is { } f0 && to is { } f1 && f1 > f0 && points >= 2) sweep = new FrequencyRange(f0, f1, points, spacing);
        }

        var refine = true;
        if (h["refine"] is { } rNode)
        {
            if (rNode is YScalar { Value: "true" or "false" } rs) refine = rs.Value == "true";
            else context.Error(rNode, "'refine' of 'harmonic' must be true or false");
        }

        var method = HarmonicMethod.Direct;
        if (h["method"] is { } mNode && context.Text(mNode, "'method' of 'harmonic'") is { } m)
        {
            if (m == "modal") method = HarmonicMethod.Modal;
            else if (m != "direct") context.Error(mNode, $"'method' of 'harmonic' is '{m}'{ReadContext.Suggest(m, ["direct", "modal"])}; write 'direct' or 'modal'");
        }

        int? modes = null;
        if (h["modes"] is { } nNode)
        {
            if (nNode is YScalar ns && int.TryParse(ns.Value, NumberStyles.None, CultureInfo.InvariantCulture, out var n) && n >= 1) modes = n;
            else context.Error(nNode, "'modes' of 'harmonic' must be a whole number of modes, at least 1");
        }

        return sweep is null ? null : new HarmonicSpec(loadNames, sweep, refine, outputs, method, modes);
    }

    private static ImmutableArray<string> NameList(YMapping h, string key, IReadOnlySet<string> known, string element, string section, ReadContext context)
    {
        if (h[key] is not { } node) return [];
        if (node is not YSequence seq)
        {
            context.Error(node, $"'{key}' of 'harmonic' must be a list of {element} names, e.g. [{known.Order().FirstOrDefault() ?? "name"}]");
            return [];
        }
        var names = ImmutableArray.CreateBuilder<string>();
        foreach (var item in seq.Items)
        {
            if (context.Text(item, $"'{key}' of 'harmonic'") is not { } name) continue;
            if (!known.Contains(name))
                context.Error(item, $"'{key}' of 'harmonic' names unknown {element} '{name}'{ReadContext.Suggest(name, known)}; declare it under {section}");
            else if (names.Contains(name))
                context.Error(item, $"'{key}' of 'harmonic' names '{name}' twice");
            else names.Add(name);
        }
        return names.ToImmutable();
    }
}
