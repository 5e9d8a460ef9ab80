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
        new(name)
        {
            Description = "The mass the absorber hangs on. In plane and 3d models a point and the translation the absorber acts along: a DOF label " +
                "('deck.z', 'skid.x' at the body's centre of mass) or a body point with a direction ('skid.top.x').",
            Required = required,
        };

    public static Option<CommandValue?> MassRatio(bool required)
    {
        var option = CommandValues.Quantity("--mass-ratio", Quantity.Ratio, "Absorber mass over the mode's modal mass at the host, e.g. '5 %' or 0.05.", ValueBound.Positive);
        option.Required = required;
        return option;
    }

    public static Option<int?> Mode(string name) =>
        CommandValues.Count(name, "Mode to control (default: the mode nearest a running speed × order of criteria.separation or a load's running speed; with no speed, the mode with the largest motion at the host).", 1);

    public static Option<CommandValue?> SpeedTolerance(string name) =>
        CommandValues.Quantity(name, Quantity.Ratio,
            "For --target speed: the speed variation and mistuning the design must tolerate, ± this fraction of each running speed, e.g. '5 %' (the default) or 0 for the undamped absorber at the exact speed.",
            ValueBound.NonNegative);

    public static Option<TuningMethod> Method(string name) =>
        CommandValues.Choice(name,
            "den-hartog (the classical closed form for the target; the default) or optimal (numerical minimisation of the host's worst peak on the full network).",
            ("den-hartog", TuningMethod.DenHartog), ("optimal", TuningMethod.Optimal));

    public static bool IsOptimal(TuningMethod method) => method == TuningMethod.Optimal;

    /// <summary>How the absorber is tuned: the classical closed form, or numerically on the full network.</summary>
    public enum TuningMethod
    {
        DenHartog,
        Optimal,
    }

    /// <summary>The request, or null after printing every problem (unknown host, mode out of range).</summary>
    public static AbsorberRequest? Request(ModalResult modal, string host, CommandValue ratio, int? mode, ImmutableArray<double> excitations,
        AbsorberTarget target, Streams io, CommandValue? speedTolerance = null)
    {
        var request = new AbsorberRequest(host, ratio.Si, mode, excitations, target, speedTolerance?.Si ?? AbsorberRequest.DefaultSpeedTolerance);
        var problems = AbsorberTuning.Problems(modal, request);
        if (problems.Length == 0) return request;
        foreach (var p in problems) io.Error.WriteLine($"modalchain: error: {p}");
        return null;
    }
}
