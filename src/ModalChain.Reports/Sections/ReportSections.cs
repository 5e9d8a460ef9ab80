using System.Collections.Immutable;

namespace ModalChain.Reports.Sections;

/// <summary>The sections of a report, in the order they appear.</summary>
public static class ReportSections
{
    /// <summary>Every section the tool knows; each later analysis (harmonic response, transient histories, criteria,
    /// absorber, speed-frequency chart) adds its factory here.</summary>
    public static readonly ImmutableArray<ReportSectionFactory> Default =
    [
        ModelSummarySection.Create,
        ModesSection.Create,
        HarmonicSection.Create,
        TransientSection.Create,
        CriteriaSection.Create,
        AbsorberSection.Create,
        SpeedFrequencySection.Create,
    ];

    /// <summary>The sections of a circuit model's report (a model with a <c>circuit:</c> section): the circuit, its roots,
    /// the impedance and transfer sweeps when it has a 'harmonic' range, the time response when it has a 'transient' section.</summary>
    public static readonly ImmutableArray<ReportSectionFactory> Circuit =
    [
        CircuitSummarySection.Create,
        CircuitRootsSection.Create,
        CircuitSweepSection.Create,
        CircuitTransientSection.Create,
    ];

    /// <summary>The sections for <paramref name="document"/>: <see cref="Circuit"/> for a circuit model, <see cref="Default"/> otherwise.</summary>
    public static ImmutableArray<ReportSectionFactory> For(ModalChain.Io.Model.ModelDocument document)
    {
        ArgumentNullException.ThrowIfNull(document);
        return document.Circuit is null ? Default : Circuit;
    }
}
