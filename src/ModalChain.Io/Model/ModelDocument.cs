using System.Collections.Immutable;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Model;
using ModalChain.Io.Diagnostics;

namespace ModalChain.Io.Model;

/// <summary>A model file read and checked: the network in SI units plus where each element was written.</summary>
/// <param name="File">The file name as the user gave it.</param>
/// <param name="Sha256">Lower-case hexadecimal SHA-256 of the file's bytes, so outputs can be traced to their input.</param>
/// <param name="Network">The network, all values in SI.</param>
/// <param name="Warnings">Warnings found while reading (the model is usable).</param>
/// <param name="Positions">Where each element was written: keys such as "masses.deck", "springs.columns".</param>
public sealed record ModelDocument(
    string File,
    string Sha256,
    Network Network,
    ImmutableArray<Diagnostic> Warnings,
    IReadOnlyDictionary<string, SourcePosition> Positions)
{
    /// <summary>The network with its distributed damping and its loads (SI); a model without them has none.</summary>
    public StructuralModel Structure { get; init; } = StructuralModel.Of(Network);

    /// <summary>The harmonic sweep the file asks for in its 'harmonic' section, or null when it has none.</summary>
    public HarmonicSpec? Harmonic { get; init; }

    /// <summary>Every load case of the file's 'load-cases' section, in the order written (empty when it has none).</summary>
    public ImmutableArray<LoadCase> LoadCases { get; init; } = [];

    /// <summary>The load cases a harmonic run sweeps and the rule that combines them ('cases' and 'combine' of 'harmonic'; every case by the sum rule when not given); null when the model has no 'load-cases'.</summary>
    public LoadCaseSelection? Cases { get; init; }

    /// <summary>The criteria of the file's <c>criteria:</c> section (empty when it has none).</summary>
    public CriteriaSet Criteria { get; init; } = CriteriaSet.None;

    /// <summary>The loads that have a 'time' function, for transient runs (SI); harmonic sweeps do not see them.</summary>
    public ImmutableArray<TransientExcitation> TimedLoads { get; init; } = [];

    /// <summary>The transient run the file asks for in its 'transient' section, or null when it has none.</summary>
    public TransientSpec? Transient { get; init; }

    /// <summary>
    /// The point (global axes, m) about which rotational effective masses are taken, from the file's
    /// <c>reference-point</c> (plane and 3d models); null when the file states none (the model's centre of mass is then used).
    /// </summary>
    public Point3? ReferencePoint { get; init; }
    /// <summary>For mass, stiffness and damping coefficient, the one unit symbol (the unit table's spelling, e.g. "kN/mm") in which the
    /// file writes every value of that kind; a kind written in several units, or not at all, is absent. Display layers show
    /// values in these units so a model written in kN/mm reads back in kN/mm; the values themselves stay SI.</summary>
    public IReadOnlyDictionary<Core.Units.Quantity, string> WrittenUnits { get; init; } = new Dictionary<Core.Units.Quantity, string>();

    /// <summary>The circuit of a model with a <c>circuit:</c> section, or null for a mechanical model. For a circuit,
    /// <see cref="Network"/> is its mechanical analogue (massless nodes where a node has no capacitance to ground).</summary>
    public CircuitModel? Circuit { get; init; }

    /// <summary>The circuit of a line model's <c>circuit:</c> section, or null when it has none. Its analogue nodes and
    /// elements are part of <see cref="Network"/> (marked in <see cref="Network.ElectricalNodes"/>) and its sources are
    /// loads named after them (<see cref="Core.Analyses.Circuits.CircuitSources"/>).</summary>
    public Circuit? EmbeddedCircuit { get; init; }
}

/// <summary>The outcome of reading a model file: the model, or the complete list of problems found.</summary>
/// <param name="Model">The model when there were no errors; null otherwise.</param>
/// <param name="Diagnostics">Every error and warning, in file order.</param>
public sealed record LoadResult(ModelDocument? Model, ImmutableArray<Diagnostic> Diagnostics)
{
    /// <summary>True when the model can be analysed.</summary>
    public bool Succeeded => Model is not null;

    /// <summary>The errors alone.</summary>
    public IEnumerable<Diagnostic> Errors => Diagnostics.Where(d => d.Severity == Severity.Error);
}
