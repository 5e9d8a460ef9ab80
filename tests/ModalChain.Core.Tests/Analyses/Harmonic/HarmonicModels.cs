using System.Collections.Immutable;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>Small models shared by the harmonic tests.</summary>
internal static class HarmonicModels
{
    /// <summary>A mass m on a spring k and a damper c = 2ζ√(km), both to <paramref name="support"/> (declared when not ground).</summary>
    public static Network Sdof(double m, double k, double zeta, string support = Network.Ground)
    {
        var b = new NetworkBuilder { Title = "single mass" }.AddMass("m", m);
        if (support != Network.Ground) b.AddSupport(support);
        b.AddSpring("k", support, "m", k);
        if (zeta > 0) b.AddDamper("c", support, "m", 2 * zeta * Math.Sqrt(k * m));
        return b.Build();
    }

    public static DampedSystem System(Network network, DampingModel? damping = null, params Load[] loads) =>
        DampedSystem.Build(new StructuralModel(network, damping ?? DampingModel.None, [.. loads]));

    /// <summary>A seeded random network: a chain with cross springs, some masses tied to ground; optional dampers.</summary>
    public static Network Random(int seed, int n, bool dampers)
    {
        var random = new Random(seed);
        var b = new NetworkBuilder { Title = $"random {seed}" };
        for (var i = 0; i < n; i++) b.AddMass($"m{i}", 10 + 90 * random.NextDouble());
        b.AddSpring("g0", Network.Ground, "m0", 1e5 * (0.5 + random.NextDouble()));
        for (var i = 1; i < n; i++) b.AddSpring($"s{i}", $"m{i - 1}", $"m{i}", 1e5 * (0.5 + random.NextDouble()));
        for (var c = 0; c < n / 2; c++)
        {
            var a = random.Next(n);
            var d = random.Next(n);
            if (a != d) b.AddSpring($"x{c}", $"m{a}", $"m{d}", 2e4 * random.NextDouble());
            if (dampers && a != d) b.AddDamper($"d{c}", $"m{a}", $"m{d}", 500 * random.NextDouble());
        }
        if (dampers) b.AddDamper("dg", Network.Ground, $"m{n - 1}", 800);
        return b.Build();
    }

    public static ImmutableArray<string> Names(Network network) => [.. network.Masses.Select(m => m.Name)];
}
