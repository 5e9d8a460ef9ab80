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
}
