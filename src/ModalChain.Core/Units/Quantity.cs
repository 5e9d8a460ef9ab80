namespace ModalChain.Core.Units;

/// <summary>The physical kinds of value a model file may state, each with its SI unit.</summary>
public enum Quantity
{
    /// <summary>Mass, SI unit kg.</summary>
    Mass,
    /// <summary>Translational stiffness, SI unit N/m.</summary>
    Stiffness,
    /// <summary>Viscous damping coefficient, SI unit N·s/m.</summary>
    Damping,
    /// <summary>Length or displacement, SI unit m.</summary>
    Length,
    /// <summary>Frequency or rotational speed, SI unit Hz (cycles per second).</summary>
    Frequency,
    /// <summary>Dimensionless ratio, SI unit 1 (so 2 % is 0.02).</summary>
    Ratio,
    /// <summary>Force, SI unit N.</summary>
    Force,
    /// <summary>Time, SI unit s.</summary>
    Time,
    /// <summary>Plane angle, SI unit rad.</summary>
    Angle,
    /// <summary>Velocity, SI unit m/s.</summary>
    Velocity,
    /// <summary>Acceleration, SI unit m/s².</summary>
    Acceleration,
    /// <summary>Mass-radius product of a rotating unbalance, SI unit kg·m.</summary>
    MassRadius,
    /// <summary>Rotational stiffness (moment per rotation), SI unit N·m/rad.</summary>
    RotationalStiffness,
    /// <summary>Rotational viscous damping coefficient (moment per angular velocity), SI unit N·m·s/rad.</summary>
    RotationalDamping,
    /// <summary>Moment of inertia (an entry of a rigid body's inertia matrix), SI unit kg·m².</summary>
    MomentOfInertia,
    /// <summary>Moment of a force (a torque), SI unit N·m.</summary>
    Moment,
    /// <summary>Force factor Bl of an electrodynamic transducer, SI unit T·m (= N/A = V·s/m).</summary>
    ForceFactor,
    /// <summary>Electrical resistance, SI unit Ω (also written ohm).</summary>
    Resistance,
    /// <summary>Inductance, SI unit H.</summary>
    Inductance,
    /// <summary>Capacitance, SI unit F.</summary>
    Capacitance,
    /// <summary>Voltage (electric potential difference), SI unit V.</summary>
    Voltage,
    /// <summary>Electric current, SI unit A.</summary>
    Current,
}
