using System.Numerics;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Transient;

/// <summary>Turns harmonic loads (the loads of a load case) into the time histories a transient run applies: each one's steady sinusoid at its running speed, switched on at t = 0.</summary>
/// <remarks>
/// A harmonic load is the phasor P at ω = 2π·speed of a quantity q(t) = Re(P e^{iωt}) = |P| cos(ωt + arg P) =
/// |P| sin(ωt + arg P + π/2). Force: P = F e^{iφ} (N). Unbalance: P = m·e·ω² e^{iφ} (N), and in a plane (d₁, d₂) the
/// second component is the same force a quarter turn later, m·e·ω² sin(ωt + φ) = Re(−i P e^{iωt}). Support motion:
/// the prescribed acceleration −ω²U with U the support's displacement phasor (A e^{iφ}, A e^{iφ}/(iω) or −A e^{iφ}/ω²
/// for a displacement, velocity or acceleration amplitude A). The run starts from the model's initial state, so the
/// response holds the start-up transient on top of the steady state the harmonic analysis gives.
/// </remarks>
public static class SteadyLoadHistories
{
    /// <summary>The histories of <paramref name="load"/> (two for an unbalance rotating in a plane); throws when it has no running speed.</summary>
    public static IReadOnlyList<TransientExcitation> Of(Load load)
    {
        ArgumentNullException.ThrowIfNull(load);
        if (load.SpeedHz is not (> 0 and var hz))
            throw new ArgumentException($"Load '{load.Name}' has no running speed, so it has no frequency to act at in time.", nameof(load));
        var omega = 2 * Math.PI * hz;
        switch (load)
        {
            case ForceLoad f:
                return [new ForceHistory(f.Name, f.At, 1, Sine(Complex.FromPolarCoordinates(f.Amplitude, f.Phase), hz)) { Direction = f.Direction }];
            case UnbalanceLoad u:
            {
                var p = Complex.FromPolarCoordinates(u.MassRadius * omega * omega, u.Phase);
                if (u.Plane.IsDefaultOrEmpty) return [new ForceHistory(u.Name, u.At, 1, Sine(p, hz))];
                return
                [
                    new ForceHistory(u.Name, u.At, 1, Sine(p, hz)) { Direction = u.Plane[0] },
                    new ForceHistory(u.Name, u.At, 1, Sine(-Complex.ImaginaryOne * p, hz)) { Direction = u.Plane[1] },
                ];
            }
            case BaseMotionLoad b:
            {
                var a = Complex.FromPolarCoordinates(b.Amplitude, b.Phase);
                var displacement = b.Kind switch
                {
                    BaseMotionKind.Displacement => a,
                    BaseMotionKind.Velocity => a / (Complex.ImaginaryOne * omega),
                    _ => -a / (omega * omega),
                };
                return [new SupportAccelerationHistory(b.Name, b.Support, Sine(-omega * omega * displacement, hz)) { Direction = b.Direction }];
            }
            default:
                throw new ArgumentException($"Load '{load.Name}' is a {load.GetType().Name}, which has no time history.", nameof(load));
        }
    }

    /// <summary>Re(P e^{iωt}) as a <see cref="SineFunction"/>: |P| sin(ωt + arg P + π/2).</summary>
    private static SineFunction Sine(Complex phasor, double hz) => new(phasor.Magnitude, hz, phasor.Phase + Math.PI / 2);
}
