namespace ModalChain.Core;

/// <summary>The caution every output of the tool carries, since its results feed decisions about structures people use.</summary>
public static class Cautions
{
    /// <summary>The caution as one paragraph of plain text.</summary>
    public const string Text =
        "ModalChain is a screening and design aid. A lumped mass-spring-damper model is an approximation of a real " +
        "structure: its results depend on the masses, stiffnesses and damping you supply and on what the model leaves out. " +
        "Any structure that carries people or machinery must be checked against the codes that apply where it is built " +
        "and by a licensed engineer before a decision is made on it.";
}
