namespace ModalChain.Reports.Units;

/// <summary>The units a report shows its values in; results.json stays in SI whatever is chosen.</summary>
public enum UnitSystem
{
    /// <summary>kg, N/m, N·s/m, m (the default).</summary>
    Si,

    /// <summary>lb, lbf/in, lbf·s/in, in (US customary), for models written in those units.</summary>
    Imperial,
}
