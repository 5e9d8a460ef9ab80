using System.Collections.Immutable;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Yaml;
using CoreNetwork = ModalChain.Core.Model.Network;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    private static readonly Range ForceRange = new(0, 1e10);              // N
    private static readonly Range MassRadiusRange = new(0, 1e4);          // kg·m
    private static readonly Range SpeedRange = new(1e-3, 1e5); // Hz; as the separation criterion's speeds
    private static readonly Range PhaseRange = new(-100, 100);            // rad, about ±16 turns
    private static readonly Range MotionRange = new(0, 1e6);              // m, m/s or m/s²

    private static readonly string[] LoadKinds = ["force", "unbalance", "base-motion"];

    /// <summary>Reads 'loads': named harmonic forces, rotating unbalances and support motions.</summary>
    /// <remarks>In plane and 3d models (<paramref name="spatial"/> given) loads act at masses, bodies or body points, in a stated direction.</remarks>
    private static ImmutableArray<Load> ReadLoads(YMapping top, IReadOnlySet<string> masses, IReadOnlySet<string> supports, ReadContext context,
        SpatialNodes? spatial = null)
    {
        if (top["loads"] is not { } node || node is YScalar { IsPlainNull: true }) return [];
        if (context.Mapping(node, "'loads'") is not { } loads) return [];
        var result = ImmutableArray.CreateBuilder<Load>();
        foreach (var (key, value) in loads.Entries)
        {
            if (!CheckName(key, context, "load")) continue;
            var what = $"load '{key.Value}'";
            context.Positions[$"loads.{key.Value}"] = key.Position;
            if (context.Mapping(value, what) is not { } entry) continue;
            // A load with a time function is a transient load, read by ReadTimedLoads; harmonic sweeps do not see it.
            if (entry["time"] is not null) continue;
            if (entry["kind"] is not { } kindNode)
            {
                context.Error(entry, $"{what} needs 'kind': one of {string.Join(", ", LoadKinds)}");
                continue;
            }
            var kind = context.Text(kindNode, $"'kind' of {what}");
            if (kind is null) continue;
            if (!LoadKinds.Contains(kind))
            {
                context.Error(kindNode, $"unknown kind '{kind}' of {what}{ReadContext.Suggest(kind, LoadKinds)}; accepted: {string.Join(", ", LoadKinds)}");
                continue;
            }
            var phase = context.Optional(entry, "phase", Quantity.Angle, PhaseRange, what) ?? 0;
            var speed = context.Optional(entry, "speed", Quantity.Frequency, SpeedRange, what);
            switch (kind)
            {
                case "force":
                {
                    context.RejectUnknownKeys(entry, what, "kind", "at", "amplitude", "direction", "phase", "speed");
                    var at = LoadTarget(entry, masses, spatial, what, context);
                    var direction = LoadDirection(entry, at, spatial, supportMotion: false, what, context);
                    // A moment's amplitude is in N·m, even when its direction was refused (one error, not two).
                    var moment = entry["direction"] is YScalar { Value: "rx" or "ry" or "rz" };
                    var amplitude = context.Required(entry, "amplitude", moment ? Quantity.Moment : Quantity.Force, moment ? MomentRange : ForceRange, what);
                    if (at is { } target && direction is { } d && amplitude is { } f)
                        result.Add(new ForceLoad(key.Value, target.Reference, f, phase, speed) { Direction = d });
                    break;
                }
                case "unbalance":
                {
                    context.RejectUnknownKeys(entry, what, "kind", "at", "mass-radius", "plane", "phase", "speed");
                    var at = LoadTarget(entry, masses, spatial, what, context);
                    var plane = UnbalancePlane(entry, at, spatial, what, context);
                    var me = context.Required(entry, "mass-radius", Quantity.MassRadius, MassRadiusRange, what);
                    if (at is { } target && plane is { } p && me is { } u)
                        result.Add(new UnbalanceLoad(key.Value, target.Reference, u, speed, phase) { Plane = p });
                    break;
                }
                default:
                {
                    context.RejectUnknownKeys(entry, what, "kind", "support", "direction", "displacement", "velocity", "acceleration", "phase", "speed");
                    var support = LoadSupport(entry, supports, what, context);
                    var direction = LoadDirection(entry, null, spatial, supportMotion: true, what, context);
                    var given = new[] { ("displacement", BaseMotionKind.Displacement, Quantity.Length), ("velocity", BaseMotionKind.Velocity, Quantity.Velocity),
                        ("acceleration", BaseMotionKind.Acceleration, Quantity.Acceleration) }.Where(g => entry[g.Item1] is not null).ToArray();
                    if (given.Length != 1)
                    {
                        context.Error(entry, $"{what} needs exactly one of 'displacement', 'velocity' or 'acceleration' (the amplitude of the support's motion)");
                        break;
                    }
                    var (motionKey, motionKind, quantity) = given[0];
                    var amplitude = context.Value(entry[motionKey]!, quantity, MotionRange, $"'{motionKey}' of {what}");
                    if (support is not null && direction is { } d && amplitude is { } a)
                        result.Add(new BaseMotionLoad(key.Value, support, motionKind, a, phase, speed) { Direction = d });
                    break;
                }
            }
        }
        return result.ToImmutable();
    }

    private static string? LoadMass(YMapping entry, IReadOnlySet<string> masses, string what, ReadContext context)
    {
        if (entry["at"] is not { } node)
        {
            context.Error(entry, $"{what} needs 'at': the mass it acts on");
            return null;
        }
        if (context.Text(node, $"'at' of {what}") is not { } name) return null;
        if (masses.Contains(name)) return name;
        context.Error(node, name == CoreNetwork.Ground
            ? $"{what} acts at 'ground', which does not move; apply it to a mass (or use kind: base-motion on a declared support)"
            : $"{what} acts at unknown mass '{name}'{ReadContext.Suggest(name, masses)}; declare it under 'masses'");
        return null;
    }

    private static string? LoadSupport(YMapping entry, IReadOnlySet<string> supports, string what, ReadContext context)
    {
        if (entry["support"] is not { } node)
        {
            context.Error(entry, $"{what} needs 'support': the declared support that moves");
            return null;
        }
        if (context.Text(node, $"'support' of {what}") is not { } name) return null;
        if (name == CoreNetwork.Ground)
        {
            context.Error(node, $"{what} moves 'ground', which is fixed by definition; declare a support under 'supports', connect the springs to it, and move that");
            return null;
        }
        if (supports.Contains(name)) return name;
        context.Error(node, $"{what} moves unknown support '{name}'{ReadContext.Suggest(name, supports)}; declare it under 'supports'");
        return null;
    }
}
