using System.Collections.Immutable;

namespace ModalChain.Core.Analyses.Transient;

/// <summary>A transient run as a model file asks for it: which timed loads act, from which initial state, with which settings.</summary>
/// <param name="Loads">Names of the timed loads that act together; empty for every load that has a time function.</param>
/// <param name="Initial">Initial displacement and velocity per mass; masses not listed start at rest.</param>
/// <param name="Settings">Duration, step, method, outputs and RMS window.</param>
public sealed record TransientSpec(ImmutableArray<string> Loads, ImmutableArray<InitialCondition> Initial, TransientSettings Settings);
