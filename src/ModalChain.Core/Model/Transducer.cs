namespace ModalChain.Core.Model;

/// <summary>
/// An ideal electrodynamic transducer (a moving coil in a magnet's field) coupling a mechanical node pair and an
/// electrical branch of the same line network.
/// </summary>
/// <param name="Name">Unique name of the transducer within its network.</param>
/// <param name="NodeA">Mechanical terminal a (the magnet side): a mass or support.</param>
/// <param name="NodeB">Mechanical terminal b (the coil side): a mass or support, different from <paramref name="NodeA"/>.</param>
/// <param name="BranchA">Electrical terminal n1: a node of the electrical side (flux-linkage coordinate) or a support.</param>
/// <param name="BranchB">Electrical terminal n2: a node or support, different from <paramref name="BranchA"/>.</param>
/// <param name="ForceFactor">Force factor Bl in T·m (= N/A = V·s/m); positive and finite.</param>
/// <remarks>
/// The electrical nodes use the node flux linkage λ (node voltage = dλ/dt, a mass in kg standing for a capacitance in F).
/// The port voltage is u = λ̇_n1 − λ̇_n2 = Bl·(ẋ_a − ẋ_b) and the force the port current i puts on the pair is Bl·i;
/// integrated, the transducer is the holonomic constraint λ_n1 − λ_n2 = Bl·(x_a − x_b), an ideal lever between
/// the mechanical relative displacement and the electrical flux difference. <see cref="Assembly.ConstraintElimination"/>
/// removes one coordinate per transducer (n1, or n2 when n1 is a support) by congruence, so the transducer neither
/// stores nor dissipates energy. Line models only.
/// </remarks>
public sealed record Transducer(string Name, string NodeA, string NodeB, string BranchA, string BranchB, double ForceFactor);
