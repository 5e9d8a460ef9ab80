using System.Collections.Immutable;
using System.CommandLine;
using ModalChain.Core.Analyses.Absorbers;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Units;

namespace ModalChain.Cli.Commands;

/// <summary>The absorber options shared by <c>tune</c> and <c>report</c>, and their validation against the model.</summary>
internal static class AbsorberArguments
{
    public static Option<string> Host(string name, bool required) =>
        new(name) { Description = "The mass the absorber hangs on.", Required = required };

    public static Option<string> MassRatio(bool required) =>
        new("--mass-ratio") { Description = "Absorber mass over the mode's modal mass at the host, e.g. '5 %' or 0.05.", Required = required };

    public static Option<int?> Mode(string name) =>
        new(name) { Description = "Mode to control (default: the mode nearest a running speed × order of criteria.separation or a load's running speed)." };

    public static Option<string> Method(string name)
    {
        var method = new Option<string>(name)
        {
            Description = "den-hartog (the classical closed form for the target) or optimal (numerical minimisation of the host's worst peak on the full network).",
            DefaultValueFactory = _ => "den-hartog",
        };
        method.AcceptOnlyFromAmong("den-hartog", "optimal");
        return method;
    }

    public static bool IsOptimal(string? method) => method == "optimal";

    /// <summary>The request, or null after printing every problem (mass ratio that does not parse, unknown host, mode out of range).</summary>
    public static AbsorberRequest? Request(ModalResult modal, string host, string ratioText, int? mode, ImmutableArray<double> excitations,
        AbsorberTarget target, Streams io)
    {
        var mu = QuantityParser.Parse(ratioText, Quantity.Ratio);
        if (!mu.Succeeded)
        {
            io.Error.WriteLine($"modalchain: error: --mass-ratio '{ratioText}': {mu.Error}");
            return null;
        }
        var request = new AbsorberRequest(host, mu.Value, mode, excitations, target);
        var problems = AbsorberTuning.Problems(modal, request);
        if (problems.Length == 0) return request;
        foreach (var p in problems) io.Error.WriteLine($"modalchain: error: {p}");
        return null;
    }
}
