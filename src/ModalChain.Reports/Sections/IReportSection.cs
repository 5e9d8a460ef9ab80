using System.Text.Json;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Html;

namespace ModalChain.Reports.Sections;

/// <summary>One section of the report: its HTML, its figures and its numbers in results.json.</summary>
/// <remarks>
/// Each analysis adds one class implementing this interface and one factory line in <see cref="ReportSections.Default"/>;
/// sections know nothing of each other. A factory returns null when the model has nothing for its section (e.g. no
/// <c>harmonic:</c> block), so the report shows only what was analysed.
/// </remarks>
public interface IReportSection
{
    /// <summary>Key of the section in results.json and its anchor in the HTML ("model", "modes", "harmonic").</summary>
    string Key { get; }

    /// <summary>Heading of the section.</summary>
    string Title { get; }

    /// <summary>The figures of the section, in the order shown; each is also written as its own file.</summary>
    IReadOnlyList<ReportFigure> Figures { get; }

    /// <summary>Writes the section's body (below its heading), including its figures via <see cref="HtmlWriter.Figure"/>.</summary>
    void WriteHtml(HtmlWriter html);

    /// <summary>Writes the section's value (an object) for its <see cref="Key"/> in results.json, SI units.</summary>
    void WriteJson(Utf8JsonWriter json);
}

/// <summary>Creates a section from the report context, or returns null when the model does not call for it.</summary>
/// <remarks>May throw <see cref="ModalChain.Core.NumericalFailureException"/>; the report then fails as a whole and nothing is written.</remarks>
public delegate IReportSection? ReportSectionFactory(ReportContext context);
