namespace ModalChain.Core.Analyses.Absorbers;

/// <summary>The caution every absorber design carries, in addition to <see cref="Cautions.Text"/>.</summary>
public static class AbsorberCaution
{
    /// <summary>The caution as one paragraph of plain text.</summary>
    public const string Text =
        "A tuned absorber changes the dynamics of the structure and can fail: it detunes when the structure's mass or " +
        "stiffness changes (load, temperature, ageing, a different machine), its spring can fail in fatigue, and its mass " +
        "needs room and stops for its stroke. A detuned absorber can make the response worse than none. The design here " +
        "comes from a lumped model; have it checked, built and commissioned (including a measured tuning) under licensed " +
        "engineering practice and the codes that apply.";
}
