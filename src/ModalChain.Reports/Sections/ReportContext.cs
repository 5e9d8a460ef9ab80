using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Io.Model;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Sections;

/// <summary>What every section may use: the model, the options and the analyses shared between sections (each computed once).</summary>
public sealed class ReportContext
{
    private readonly Lazy<ModalResult> _modal;
    private readonly Lazy<NetworkLayout> _layout;
    private readonly Lazy<SpatialGeometry?> _geometry;
    private readonly Lazy<DampedSystem> _damped;
    private readonly Lazy<HarmonicResult?> _harmonic;
    private readonly Lazy<LoadCaseResult?> _loadCases;

    /// <summary>Creates the context of one report run.</summary>
    public ReportContext(ModelDocument document, ReportOptions options)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(options);
        Document = document;
        Options = options;
        Units = new DisplayUnits(options.Units ?? DisplayUnits.SystemOf(document.WrittenUnits), document.WrittenUnits);
        // The damped system already holds every undamped mode: the report's modes are its lowest ones, not a second solve.
        _modal = new Lazy<ModalResult>(() =>
        {
            var all = Damped.Modes;
            return all.Modes.Length <= options.MaxModes ? all : all with { Modes = [.. all.Modes.Take(options.MaxModes)] };
        });
        _layout = new Lazy<NetworkLayout>(() => NetworkLayout.For(document.Network));
        _geometry = new Lazy<SpatialGeometry?>(() => document.Network.Space == Core.Model.ModelSpace.Line ? null : SpatialGeometry.For(document.Network));
        _damped = new Lazy<DampedSystem>(() => DampedSystem.Build(document.Structure,
            new ModalOptions(Choice: options.Solver, Count: LowestModesSuffice(document, options) ? options.MaxModes : null)));
        _harmonic = new Lazy<HarmonicResult?>(() =>
            document.Harmonic is { } spec && !document.Structure.Loads.IsEmpty && document.Cases is null ? HarmonicAnalysis.Solve(Damped, spec) : null);
        _loadCases = new Lazy<LoadCaseResult?>(() =>
            document.Harmonic is { } spec && document.Cases is { } cases ? LoadCaseAnalysis.Solve(Damped, spec, cases) : null);
    }

    /// <summary>Models with more masses than this solve only the lowest <see cref="ReportOptions.MaxModes"/> modes when nothing else in the report needs them all.</summary>
    public const int PartialSolveAboveMasses = 1000;

    /// <summary>
    /// True when the report shows nothing but the lowest <see cref="ReportOptions.MaxModes"/> modes (no harmonic sweep,
    /// transient run, criteria or absorber) of a model with more than <see cref="PartialSolveAboveMasses"/> masses: then
    /// only those are solved (a sparse shift-invert solve instead of every mode of a dense one; a 10,000-mass grid takes
    /// seconds instead of many minutes) and the quality figures cover them.
    /// </summary>
    public static bool LowestModesSuffice(ModelDocument document, ReportOptions options)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(options);
        return document.Network.Masses.Length > PartialSolveAboveMasses && document.Harmonic is null && document.Transient is null
            && document.Criteria.IsEmpty && options.Absorber is null;
    }

    /// <summary>The model as read.</summary>
    public ModelDocument Document { get; }

    /// <summary>The options of the run.</summary>
    public ReportOptions Options { get; }

    /// <summary>Display units of the HTML and figures.</summary>
    public DisplayUnits Units { get; }

    /// <summary>The lowest <see cref="ReportOptions.MaxModes"/> modes (quality figures are over every mode solved).</summary>
    public ModalResult Modal => _modal.Value;

    /// <summary>The model with its damping assembled and every undamped mode solved (shared by the damped analyses).</summary>
    public DampedSystem Damped => _damped.Value;

    /// <summary>The harmonic sweep the model asks for, or null when it has no 'harmonic' section, no loads, or load cases.</summary>
    public HarmonicResult? Harmonic => _harmonic.Value;

    /// <summary>The sweep of each load case and their combination, or null when the model has no 'harmonic' section or no 'load-cases'.</summary>
    public LoadCaseResult? LoadCases => _loadCases.Value;

    /// <summary>The drawing layout of a line model's network (laid out on first use); plane and 3d models are drawn from <see cref="Geometry"/>.</summary>
    public NetworkLayout Layout => _layout.Value;

    /// <summary>The mechanical geometry of a plane or 3d model as its figures draw it; null for a line model.</summary>
    public SpatialGeometry? Geometry => _geometry.Value;
}
