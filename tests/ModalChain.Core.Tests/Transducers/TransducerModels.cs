using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Transducers;

/// <summary>
/// Small invented transducer models. The electrical side is written in its node-flux form: an electrical node is a
/// mass whose kilograms are its capacitance to ground in farads, a resistor R is a damper 1/R, an inductor L a spring
/// 1/L, and a voltage source from ground is a support whose velocity is the source voltage.
/// </summary>
internal static class TransducerModels
{
    /// <summary>
    /// A moving-coil velocity sensor read in its housing's frame: seismic mass "m" on spring k and damper c to ground
    /// (the housing), coil between [ground, m] with force factor Bl, port node "sense" (capacitance <paramref name="senseCapacitance"/>
    /// to ground) and, when <paramref name="shuntOhms"/> is given, a resistor across the port.
    /// </summary>
    public static Network Sensor(double m, double k, double c, double bl, double senseCapacitance, double? shuntOhms = null)
    {
        var b = new NetworkBuilder { Title = "velocity sensor" }
            .AddMass("m", m).AddMass("sense", senseCapacitance)
            .AddSpring("k", Network.Ground, "m", k)
            .AddDamper("c", Network.Ground, "m", c);
        if (shuntOhms is { } r) b.AddDamper("shunt", "sense", Network.Ground, 1 / r);
        b.AddTransducer("coil", Network.Ground, "m", "sense", Network.Ground, bl);
        return b.Build();
    }

    /// <summary>
    /// A shaker: voltage source "amp" (a support moved at the source voltage) through the coil resistance R_e to the
    /// port node "port" (capacitance <paramref name="portCapacitance"/>), coil between [table, ground], table mass on
    /// spring k and damper c to ground.
    /// </summary>
    public static Network Shaker(double m, double k, double c, double bl, double resistance, double portCapacitance) =>
        new NetworkBuilder { Title = "shaker" }
            .AddMass("table", m).AddMass("port", portCapacitance).AddSupport("amp")
            .AddSpring("k", Network.Ground, "table", k)
            .AddDamper("c", Network.Ground, "table", c)
            .AddDamper("re", "amp", "port", 1 / resistance)
            .AddTransducer("coil", "table", Network.Ground, "port", Network.Ground, bl)
            .Build();
}
