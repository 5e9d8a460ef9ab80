using System.Collections.Immutable;

namespace ModalChain.Core.Model;

/// <summary>A named set of loads that act together, such as one machine running: swept and charted on its own.</summary>
/// <remarks>
/// The loads of one case add as complex amplitudes (one machine, known phases). Two cases are two machines whose
/// phases are unrelated, often at different speeds; their responses are never added at one frequency but combined at
/// the operating points by a stated rule (<see cref="Analyses.Harmonic.CaseCombination"/>).
/// </remarks>
/// <param name="Name">Unique name of the case within its model.</param>
/// <param name="Loads">Names of the harmonic loads of the case, at least one, in the order written.</param>
public sealed record LoadCase(string Name, ImmutableArray<string> Loads);
