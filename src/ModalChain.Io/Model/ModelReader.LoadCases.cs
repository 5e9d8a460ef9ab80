using System.Collections.Immutable;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.Io.Yaml;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    private static readonly string[] CombinationRules = ["sum", "rms"];

    /// <summary>Reads 'load-cases': named sets of harmonic loads, each swept on its own and combined at the operating points.</summary>
    /// <remarks>A case is a list of load names, or a mapping with 'loads' (room for per-case settings).</remarks>
    private static ImmutableArray<LoadCase> ReadLoadCases(YMapping top, ImmutableArray<Load> loads, ReadContext context)
    {
        if (top["load-cases"] is not { } node || node is YScalar { IsPlainNull: true }) return [];
        if (context.Mapping(node, "'load-cases'") is not { } cases) return [];
        var declared = (top["loads"] as YMapping)?.Entries.ToDictionary(e => e.Key.Value, e => e.Value) ?? [];
        var harmonicLoads = loads.Select(l => l.Name).ToImmutableHashSet();
        if (cases.Entries.Length == 0) context.Error(cases, "'load-cases' declares no case; give each case a name and its loads, e.g. {exhaust-fan: [fan-1-unbalance]}");
        var result = ImmutableArray.CreateBuilder<LoadCase>();
        foreach (var (key, value) in cases.Entries)
        {
            if (!CheckName(key, context, "load case")) continue;
            var what = $"load case '{key.Value}'";
            context.Positions[$"load-cases.{key.Value}"] = key.Position;
            var list = value;
            if (value is YMapping entry)
            {
                context.RejectUnknownKeys(entry, what, "loads");
                if (entry["loads"] is not { } inner)
                {
                    context.Error(entry, $"{what} needs 'loads': the names of the loads that act together in it");
                    continue;
                }
                list = inner;
            }
            if (list is not YSequence seq)
            {
                context.Error(list, $"{what} must be a list of load names, e.g. [{declared.Keys.FirstOrDefault() ?? "fan-unbalance"}]");
                continue;
            }
            if (seq.Items.Length == 0)
            {
                context.Error(seq, $"{what} lists no load; name at least one load declared under 'loads'");
                continue;
            }
            var names = ImmutableArray.CreateBuilder<string>();
            var complete = true;
            foreach (var item in seq.Items)
            {
                if (context.Text(item, $"a load of {what}") is not { } name) { complete = false; continue; }
                if (!declared.TryGetValue(name, out var loadNode))
                {
                    context.Error(item, $"{what} names unknown load '{name}'{ReadContext.Suggest(name, declared.Keys)}; declare it under 'loads'");
                    complete = false;
                }
                else if (loadNode is YMapping { } timed && timed["time"] is not null)
                {
                    context.Error(item, $"{what} names '{name}', which has a 'time' function: it acts in transient runs only; a load case holds harmonic loads");
                    complete = false;
                }
                else if (names.Contains(name))
                {
                    context.Error(item, $"{what} names '{name}' twice");
                    complete = false;
                }
                else if (!harmonicLoads.Contains(name)) complete = false; // the load itself has an error, reported where it is written
                else names.Add(name);
            }
            if (complete) result.Add(new LoadCase(key.Value, names.ToImmutable()));
        }
        return result.ToImmutable();
    }

    /// <summary>The cases a harmonic run sweeps ('cases' of 'harmonic', else every case) and their combination rule ('combine', else sum); null without 'load-cases'.</summary>
    private static LoadCaseSelection? ReadCaseSelection(YMapping top, ImmutableArray<LoadCase> cases, ReadContext context)
    {
        var h = top["harmonic"] as YMapping;
        var hasCases = top["load-cases"] is YMapping { Entries.Length: > 0 };
        var rule = CaseCombination.Sum;
        if (h?["combine"] is { } cNode && context.Text(cNode, "'combine' of 'harmonic'") is { } word)
        {
            if (!CombinationRules.Contains(word))
                context.Error(cNode, $"unknown combination rule '{word}' in 'combine' of 'harmonic'{ReadContext.Suggest(word, CombinationRules)}; write 'sum' (the sum of amplitudes, an upper bound of the peak) or 'rms' (root sum of squares)");
            else if (!hasCases)
                context.Error(cNode, "'combine' of 'harmonic' combines load cases, but the model has no 'load-cases'");
            else rule = word == "sum" ? CaseCombination.Sum : CaseCombination.Rms;
        }
        if (h?["loads"] is { } loadsNode && hasCases)
            context.Error(loadsNode, "'harmonic' names 'loads', but the model declares 'load-cases', each swept on its own; choose cases with 'cases' of 'harmonic' instead");

        var chosen = cases;
        if (h?["cases"] is { } casesNode)
        {
            if (!hasCases)
                context.Error(casesNode, "'cases' of 'harmonic' chooses load cases, but the model has no 'load-cases' section; declare them there");
            else if (casesNode is not YSequence seq || seq.Items.Length == 0)
                context.Error(casesNode, $"'cases' of 'harmonic' must be a list of load case names, e.g. [{cases.FirstOrDefault()?.Name ?? "exhaust-fan"}]");
            else
            {
                var declared = ((YMapping)top["load-cases"]!).Entries.Select(e => e.Key.Value).ToImmutableHashSet();
                var names = new List<string>();
                foreach (var item in seq.Items)
                {
                    if (context.Text(item, "'cases' of 'harmonic'") is not { } name) continue;
                    if (!declared.Contains(name))
                        context.Error(item, $"'cases' of 'harmonic' names unknown load case '{name}'{ReadContext.Suggest(name, declared)}; declare it under 'load-cases'");
                    else if (names.Contains(name)) context.Error(item, $"'cases' of 'harmonic' names '{name}' twice");
                    else names.Add(name);
                }
                chosen = [.. names.Select(n => cases.FirstOrDefault(c => c.Name == n)).OfType<LoadCase>()];
            }
        }
        return hasCases && !chosen.IsEmpty ? new LoadCaseSelection(chosen, rule) : null;
    }
}
