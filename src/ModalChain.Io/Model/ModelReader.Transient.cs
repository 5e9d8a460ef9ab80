using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Units;
using ModalChain.Io.Yaml;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    private static readonly Range InitialDisplacementRange = new(-100, 100);   // m
    private static readonly Range InitialVelocityRange = new(-1e3, 1e3);      // m/s
    private static readonly Range StepRange = new(0, 1e4, MinimumInclusive: false); // s
    private const double MaxSteps = TransientSettings.MaxSteps;

    private static readonly string[] TimedLoadKinds = ["force", "unbalance", "base-motion"];
    private static readonly string[] TransientMethods = ["newmark", "hht", "exact", "modal"];

    /// <summary>Reads the loads that carry a 'time' function: forces and support accelerations in time, unbalances that run up or down.</summary>
    /// <remarks>
    /// In plane and 3d models (<paramref name="spatial"/> given) they read as the harmonic loads do: a force (or a moment on a
    /// body) at a mass, body or body point in a stated direction, an unbalance turning in a plane of two translations, a
    /// support moving in a stated translation.
    /// </remarks>
    private static ImmutableArray<TransientExcitation> ReadTimedLoads(YMapping top, IReadOnlySet<string> masses,
        IReadOnlySet<string> supports, ReadContext context, SpatialNodes? spatial = null)
    {
        if (top["loads"] is not YMapping loads) return [];
        var result = ImmutableArray.CreateBuilder<TransientExcitation>();
        foreach (var (key, value) in loads.Entries)
        {
            if (value is not YMapping entry || entry["time"] is not { } time) continue;
            var name = key.Value;
            var what = $"load '{name}'";
            if (entry["kind"] is not { } kindNode)
            {
                context.Error(entry, $"{what} needs 'kind': one of {string.Join(", ", TimedLoadKinds)}");
                continue;
            }
            if (context.Text(kindNode, $"'kind' of {what}") is not { } kind) continue;
            var timeWhat = $"'time' of {what}";
            switch (kind)
            {
                case "force":
                {
                    context.RejectUnknownKeys(entry, what, "kind", "at", "direction", "time");
                    var at = LoadTarget(entry, masses, spatial, what, context);
                    var direction = LoadDirection(entry, at, spatial, supportMotion: false, what, context);
                    // A moment's time function is in N·m, even when its direction was refused (one error, not two).
                    var moment = spatial is not null && entry["direction"] is YScalar { Value: "rx" or "ry" or "rz" };
                    var f = ReadValueFunction(time, moment ? Quantity.Moment : Quantity.Force, timeWhat, context);
                    if (at is { } target && direction is { } d && f is not null) result.Add(new ForceHistory(name, target.Reference, 1.0, f) { Direction = d });
                    break;
                }
                case "unbalance":
                {
                    context.RejectUnknownKeys(entry, what, "kind", "at", "mass-radius", "plane", "time");
                    var at = LoadTarget(entry, masses, spatial, what, context);
                    var plane = UnbalancePlane(entry, at, spatial, what, context);
                    var me = context.Required(entry, "mass-radius", Quantity.MassRadius, MassRadiusRange, what);
                    var f = ReadSpeedFunction(time, timeWhat, context);
                    if (at is not { } target || plane is not { } p || me is not { } u || f is null) break;
                    if (p.IsEmpty) result.Add(new ForceHistory(name, target.Reference, u, f));
                    else
                    {
                        // m·e(ω² cos θ + α sin θ) along the first direction; the same with θ − π/2, m·e(ω² sin θ − α cos θ), along the second.
                        result.Add(new ForceHistory(name, target.Reference, u, f) { Direction = p[0] });
                        result.Add(new ForceHistory(name, target.Reference, u, f with { PhaseRadians = f.PhaseRadians - Math.PI / 2 }) { Direction = p[1] });
                    }
                    break;
                }
                case "base-motion":
                {
                    context.RejectUnknownKeys(entry, what, "kind", "support", "direction", "time");
                    var support = LoadSupport(entry, supports, what, context);
                    var direction = LoadDirection(entry, null, spatial, supportMotion: true, what, context);
                    var f = ReadValueFunction(time, Quantity.Acceleration, $"{timeWhat} (the support's acceleration)", context);
                    if (support is not null && direction is { } d && f is not null) result.Add(new SupportAccelerationHistory(name, support, f) { Direction = d });
                    break;
                }
                default:
                    context.Error(kindNode, $"unknown kind '{kind}' of {what}{ReadContext.Suggest(kind, TimedLoadKinds)}; accepted: {string.Join(", ", TimedLoadKinds)}");
                    break;
            }
        }
        return result.ToImmutable();
    }

    /// <summary>Reads 'transient': duration, step, method, loads, outputs, initial conditions and the RMS window.</summary>
    /// <remarks><paramref name="sources"/>: a line model's circuit sources by name, true for those with a waveform ('time').</remarks>
    private static TransientSpec? ReadTransient(YMapping top, IReadOnlySet<string> masses, ImmutableArray<TransientExcitation> timedLoads,
        ReadContext context, IReadOnlySet<string>? initialNames = null, bool spatial = false, IReadOnlyDictionary<string, bool>? sources = null)
    {
        if (top["transient"] is not { } node || node is YScalar { IsPlainNull: true }) return null;
        if (context.Mapping(node, "'transient'") is not { } t) return null;
        const string what = "'transient'";
        context.RejectUnknownKeys(t, what, "duration", "step", "method", "alpha", "modes", "loads", "outputs", "initial", "rms", "record-every");
        context.Positions["transient"] = t.Position;

        var duration = context.Required(t, "duration", Quantity.Time, DurationRange, what);
        var step = context.Required(t, "step", Quantity.Time, StepRange, what);
        if (duration is { } d && step is { } h)
        {
            if (h > d)
                context.Error(t["step"]!, $"'step' of {what} ({Format(h)} s) is longer than 'duration' ({Format(d)} s); take a step of at most a tenth of the shortest period of interest");
            else if (d / h > MaxSteps)
                context.Error(t["step"]!, $"{what} asks for {d / h:G3} steps (duration / step), more than {MaxSteps:G2}; lengthen the step or shorten the run");
        }

        var method = TransientMethod.Newmark;
        if (t["method"] is { } mNode && context.Text(mNode, $"'method' of {what}") is { } m)
        {
            var index = Array.IndexOf(TransientMethods, m);
            if (index >= 0) method = (TransientMethod)index;
            else context.Error(mNode, $"'method' of {what} is '{m}'{ReadContext.Suggest(m, TransientMethods)}; write one of {string.Join(", ", TransientMethods)}");
        }
        var alpha = context.Optional(t, "alpha", Quantity.Ratio, new Range(-1.0 / 3.0, 0), what) ?? -0.05;
        if (t["alpha"] is not null && method != TransientMethod.Hht)
            context.Warning(t["alpha"]!.Position, $"'alpha' of {what} only applies to method: hht and is ignored");

        int? modes = null;
        if (t["modes"] is { } nNode)
        {
            if (nNode is YScalar ns && int.TryParse(ns.Value, NumberStyles.None, CultureInfo.InvariantCulture, out var n) && n >= 1) modes = n;
            else context.Error(nNode, $"'modes' of {what} must be a whole number of modes, at least 1");
        }
        var recordEvery = 1;
        if (t["record-every"] is { } rNode)
        {
            if (rNode is YScalar rs && int.TryParse(rs.Value, NumberStyles.None, CultureInfo.InvariantCulture, out var r) && r >= 1) recordEvery = r;
            else context.Error(rNode, $"'record-every' of {what} must be a whole number of steps, at least 1");
        }

        var timedNames = timedLoads.Select(l => l.Name).ToImmutableHashSet();
        var loadNames = ImmutableArray.CreateBuilder<string>();
        if (t["loads"] is { } lNode)
        {
            if (lNode is not YSequence seq) context.Error(lNode, $"'loads' of {what} must be a list of load names, e.g. [{timedNames.Order().FirstOrDefault() ?? "start-up"}]");
            else
                foreach (var item in seq.Items)
                {
                    if (context.Text(item, $"'loads' of {what}") is not { } name) continue;
                    var declared = (top["loads"] as YMapping)?[name];
                    if (sources is not null && sources.TryGetValue(name, out var timed))
                    {
                        if (!timed)
                            context.Error(item, $"'loads' of {what} names circuit source '{name}', which has no 'time' waveform (it drives harmonic runs only); give it one, e.g. time: {{kind: step, value: 1 V, at: 0 s}}");
                        else if (loadNames.Contains(name)) context.Error(item, $"'loads' of {what} names '{name}' twice");
                        else loadNames.Add(name);
                    }
                    else if (declared is YMapping entry && entry["time"] is null)
                        context.Error(item, $"'loads' of {what} names '{name}', which has no 'time' function (it is a harmonic load); give it one, e.g. time: {{kind: step, value: 2 kN, at: 0.1 s}}");
                    else if (declared is null)
                        context.Error(item, $"'loads' of {what} names unknown load '{name}'{ReadContext.Suggest(name, timedNames)}; declare it under 'loads' with a 'time' function");
                    else if (loadNames.Contains(name)) context.Error(item, $"'loads' of {what} names '{name}' twice");
                    else loadNames.Add(name);
                }
        }

        var outputs = ImmutableArray.CreateBuilder<string>();
        if (t["outputs"] is { } oNode)
        {
            if (oNode is not YSequence seq) context.Error(oNode, $"'outputs' of {what} must be a list of mass names");
            else
                foreach (var item in seq.Items)
                {
                    if (context.Text(item, $"'outputs' of {what}") is not { } name) continue;
                    if (!masses.Contains(name)) context.Error(item, $"'outputs' of {what} names unknown mass '{name}'{ReadContext.Suggest(name, masses)}; declare it under 'masses'");
                    else if (outputs.Contains(name)) context.Error(item, $"'outputs' of {what} names '{name}' twice");
                    else outputs.Add(name);
                }
        }

        var initial = ImmutableArray.CreateBuilder<InitialCondition>();
        if (t["initial"] is { } iNode && context.Mapping(iNode, $"'initial' of {what}") is { } im)
        {
            foreach (var (massKey, stateNode) in im.Entries)
            {
                var iw = $"the initial state of '{massKey.Value}'";
                var starts = initialNames ?? masses;
                if (!starts.Contains(massKey.Value))
                {
                    context.Error(massKey, spatial
                        ? $"'initial' of {what} names '{massKey.Value}', which is not a translation DOF label of the model (such as 'deck.z' or 'skid.x'; a mass that moves in one direction by its name){ReadContext.Suggest(massKey.Value, starts)}; rotations start at rest"
                        : $"'initial' of {what} names unknown mass '{massKey.Value}'{ReadContext.Suggest(massKey.Value, masses)}");
                    continue;
                }
                if (context.Mapping(stateNode, iw) is not { } state) continue;
                context.RejectUnknownKeys(state, iw, "displacement", "velocity");
                var u0 = context.Optional(state, "displacement", Quantity.Length, InitialDisplacementRange, iw) ?? 0;
                var v0 = context.Optional(state, "velocity", Quantity.Velocity, InitialVelocityRange, iw) ?? 0;
                initial.Add(new InitialCondition(massKey.Value, u0, v0));
            }
        }

        double? rmsFrom = null, rmsTo = null;
        if (t["rms"] is { } wNode && context.Mapping(wNode, $"'rms' of {what}") is { } w)
        {
            context.RejectUnknownKeys(w, $"'rms' of {what}", "from", "to");
            rmsFrom = context.Optional(w, "from", Quantity.Time, InstantRange, $"'rms' of {what}");
            rmsTo = context.Optional(w, "to", Quantity.Time, InstantRange, $"'rms' of {what}");
            if (rmsFrom is { } a && rmsTo is { } b && !(b > a))
                context.Error(w["to"]!, $"'to' of 'rms' ({Format(b)} s) must be after 'from' ({Format(a)} s)");
        }

        if (loadNames.Count == 0 && t["loads"] is null && timedLoads.IsEmpty && initial.Count == 0)
            context.Error(t, $"{what} has nothing to respond to: give loads with a 'time' function or 'initial' conditions");

        if (duration is not { } dur || step is not { } stp || stp > dur || context.HasErrors) return null;
        var settings = new TransientSettings(dur, stp, method)
        {
            HhtAlpha = alpha,
            ModeCount = modes,
            Outputs = outputs.ToImmutable(),
            RmsFrom = rmsFrom,
            RmsTo = rmsTo,
            RecordEvery = recordEvery,
        };
        return new TransientSpec(loadNames.ToImmutable(), initial.ToImmutable(), settings);
    }
}
