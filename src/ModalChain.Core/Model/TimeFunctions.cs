using System.Collections.Immutable;

namespace ModalChain.Core.Model;

/// <summary>How a load varies in time: a scalar function of time evaluated without allocation.</summary>
/// <remarks>
/// For a force load the value is the force in N. For an unbalance (<see cref="UnbalanceSpeedRamp"/>) the value is
/// the force per unit mass-radius in N/(kg·m) = rad²/s², so the force is m·e times the value. For base motion the
/// value is the support's acceleration in m/s². Before its start every function except <see cref="SineFunction"/>
/// and <see cref="UnbalanceSpeedRamp"/> is zero.
/// </remarks>
public abstract record TimeFunction
{
    /// <summary>The value at time <paramref name="time"/> (s); unit as stated by the load the function belongs to.</summary>
    public abstract double ValueAt(double time);

    /// <summary>The times (s) where the function has a kink or a jump, so a caller can warn when a step straddles them.</summary>
    public virtual IEnumerable<double> Breakpoints => [];
}

/// <summary>A step: zero before <see cref="At"/>, <see cref="Value"/> from then on.</summary>
/// <param name="Value">Value after the step (N for a force, m/s² for a base acceleration).</param>
/// <param name="At">Time of the step in s; non-negative.</param>
public sealed record StepFunction(double Value, double At) : TimeFunction
{
    /// <inheritdoc />
    public override double ValueAt(double time) => time >= At ? Value : 0.0;

    /// <inheritdoc />
    public override IEnumerable<double> Breakpoints => [At];
}

/// <summary>A ramp from <see cref="From"/> at <see cref="Start"/> to <see cref="To"/> at Start + <see cref="Over"/>, held afterwards.</summary>
/// <param name="From">Value at the start of the ramp (N or m/s²); also the value before it, from t = 0.</param>
/// <param name="To">Value at the end of the ramp and after it.</param>
/// <param name="Over">Rise time in s; positive.</param>
/// <param name="Start">Time the ramp starts in s; non-negative.</param>
public sealed record RampFunction(double From, double To, double Over, double Start = 0.0) : TimeFunction
{
    /// <summary>Checks the arguments once at construction (caller bugs are argument exceptions).</summary>
    public double Over { get; } = Over > 0 && double.IsFinite(Over)
        ? Over : throw new ArgumentOutOfRangeException(nameof(Over), Over, "The ramp time must be positive and finite.");

    /// <inheritdoc />
    public override double ValueAt(double time)
    {
        if (time <= Start) return From;
        if (time >= Start + Over) return To;
        return From + (To - From) * (time - Start) / Over;
    }

    /// <inheritdoc />
    public override IEnumerable<double> Breakpoints => [Start, Start + Over];
}

/// <summary>A rectangular pulse of <see cref="Amplitude"/> between <see cref="Start"/> and Start + <see cref="Duration"/>.</summary>
/// <param name="Amplitude">Value during the pulse (N or m/s²).</param>
/// <param name="Duration">Pulse length in s; positive.</param>
/// <param name="Start">Time the pulse starts in s; non-negative.</param>
public sealed record RectangularPulse(double Amplitude, double Duration, double Start = 0.0) : TimeFunction
{
    /// <summary>Pulse length in s.</summary>
    public double Duration { get; } = Duration > 0 && double.IsFinite(Duration)
        ? Duration : throw new ArgumentOutOfRangeException(nameof(Duration), Duration, "The pulse duration must be positive and finite.");

    /// <inheritdoc />
    public override double ValueAt(double time) => time >= Start && time < Start + Duration ? Amplitude : 0.0;

    /// <inheritdoc />
    public override IEnumerable<double> Breakpoints => [Start, Start + Duration];
}

/// <summary>A half-sine pulse A·sin(π (t − t0)/t_d) for t0 ≤ t ≤ t0 + t_d, zero otherwise.</summary>
/// <param name="Amplitude">Peak value A (N or m/s²).</param>
/// <param name="Duration">Pulse length t_d in s; positive.</param>
/// <param name="Start">Time t0 the pulse starts in s; non-negative.</param>
public sealed record HalfSinePulse(double Amplitude, double Duration, double Start = 0.0) : TimeFunction
{
    /// <summary>Pulse length in s.</summary>
    public double Duration { get; } = Duration > 0 && double.IsFinite(Duration)
        ? Duration : throw new ArgumentOutOfRangeException(nameof(Duration), Duration, "The pulse duration must be positive and finite.");

    /// <inheritdoc />
    public override double ValueAt(double time) =>
        time >= Start && time <= Start + Duration ? Amplitude * Math.Sin(Math.PI * (time - Start) / Duration) : 0.0;

    /// <inheritdoc />
    public override IEnumerable<double> Breakpoints => [Start, Start + Duration];
}

/// <summary>A sine A·sin(2π f t + φ) from t = 0 on.</summary>
/// <param name="Amplitude">Amplitude A (N or m/s²).</param>
/// <param name="FrequencyHz">Frequency f in Hz; non-negative.</param>
/// <param name="PhaseRadians">Phase φ in rad.</param>
public sealed record SineFunction(double Amplitude, double FrequencyHz, double PhaseRadians = 0.0) : TimeFunction
{
    /// <inheritdoc />
    public override double ValueAt(double time) => Amplitude * Math.Sin(2 * Math.PI * FrequencyHz * time + PhaseRadians);
}

/// <summary>A sampled record (time, value), linearly interpolated between samples and zero outside its time span.</summary>
/// <remarks>
/// Times must be strictly increasing; the file reader reports unsorted rows with their line, this type only
/// rejects them as caller bugs. Evaluation is a binary search, O(log n), without allocation.
/// </remarks>
public sealed record TableFunction : TimeFunction
{
    /// <summary>Creates the table from matching arrays of times (s) and values (N or m/s²).</summary>
    public TableFunction(ImmutableArray<double> times, ImmutableArray<double> values)
    {
        if (times.IsDefault || values.IsDefault) throw new ArgumentNullException(times.IsDefault ? nameof(times) : nameof(values));
        if (times.Length != values.Length)
            throw new ArgumentException($"The table has {times.Length} times but {values.Length} values.", nameof(values));
        if (times.Length < 2) throw new ArgumentException("A table needs at least two samples.", nameof(times));
        for (var i = 0; i < times.Length; i++)
        {
            if (!double.IsFinite(times[i]) || !double.IsFinite(values[i]))
                throw new ArgumentException($"Sample {i} is not finite.", nameof(times));
            if (i > 0 && !(times[i] > times[i - 1]))
                throw new ArgumentException($"Times must be strictly increasing: sample {i} at {times[i]} s follows {times[i - 1]} s.", nameof(times));
        }
        Times = times;
        Values = values;
    }

    /// <summary>Sample times in s, strictly increasing.</summary>
    public ImmutableArray<double> Times { get; }

    /// <summary>Sample values, one per time.</summary>
    public ImmutableArray<double> Values { get; }

    /// <inheritdoc />
    public override double ValueAt(double time)
    {
        var t = Times.AsSpan();
        if (time < t[0] || time > t[^1]) return 0.0;
        var i = t.BinarySearch(time);
        if (i >= 0) return Values[i];
        var upper = ~i;
        var lower = upper - 1;
        var w = (time - t[lower]) / (t[upper] - t[lower]);
        return Values[lower] + w * (Values[upper] - Values[lower]);
    }

    /// <inheritdoc />
    public override IEnumerable<double> Breakpoints => Times;

    /// <inheritdoc />
    public bool Equals(TableFunction? other) =>
        other is not null && Times.AsSpan().SequenceEqual(other.Times.AsSpan()) && Values.AsSpan().SequenceEqual(other.Values.AsSpan());

    /// <inheritdoc />
    public override int GetHashCode() => HashCode.Combine(Times.Length, Times[0], Times[^1]);
}

/// <summary>A rotating unbalance whose speed changes linearly: a start-up (run-up) or a coast-down (run-down).</summary>
/// <remarks>
/// Speed ω(t) = ω0 before t0, ω0 + α (t − t0) with α = (ω1 − ω0)/T during the ramp, ω1 after it. The rotation angle
/// θ(t) = ∫₀ᵗ ω dτ is integrated exactly (it is piecewise quadratic in t). The eccentric mass sits at e·(cos θ, sin θ);
/// its inertial force on the rotor, projected on the network's direction, is m·e·(ω² cos θ + α sin θ): the
/// centripetal part plus the tangential part from the angular acceleration (which is zero at constant speed).
/// <see cref="ValueAt"/> returns ω² cos θ + α sin θ in rad²/s², the force per unit mass-radius.
/// </remarks>
/// <param name="FromRadPerSecond">Speed ω0 at the start, in rad/s; non-negative.</param>
/// <param name="ToRadPerSecond">Speed ω1 at the end, in rad/s; non-negative (below ω0 for a run-down).</param>
/// <param name="Over">Duration T of the speed change in s; positive.</param>
/// <param name="Start">Time t0 the speed starts to change in s; non-negative.</param>
/// <param name="PhaseRadians">Angle θ(0) of the unbalance at t = 0, in rad.</param>
public sealed record UnbalanceSpeedRamp(
    double FromRadPerSecond, double ToRadPerSecond, double Over, double Start = 0.0, double PhaseRadians = 0.0) : TimeFunction
{
    /// <summary>Duration of the speed change in s.</summary>
    public double Over { get; } = Over > 0 && double.IsFinite(Over)
        ? Over : throw new ArgumentOutOfRangeException(nameof(Over), Over, "The run-up time must be positive and finite.");

    /// <summary>Angular acceleration α = (ω1 − ω0)/T in rad/s² during the ramp.</summary>
    public double AngularAcceleration => (ToRadPerSecond - FromRadPerSecond) / Over;

    /// <summary>Speed ω(t) in rad/s.</summary>
    public double SpeedAt(double time)
    {
        if (time <= Start) return FromRadPerSecond;
        if (time >= Start + Over) return ToRadPerSecond;
        return FromRadPerSecond + AngularAcceleration * (time - Start);
    }

    /// <summary>Rotation angle θ(t) = θ(0) + ∫₀ᵗ ω dτ in rad, exact.</summary>
    public double AngleAt(double time)
    {
        var before = Math.Min(time, Start);
        var theta = PhaseRadians + FromRadPerSecond * before;
        if (time <= Start) return theta;
        var during = Math.Min(time, Start + Over) - Start;
        theta += FromRadPerSecond * during + 0.5 * AngularAcceleration * during * during;
        if (time > Start + Over) theta += ToRadPerSecond * (time - Start - Over);
        return theta;
    }

    /// <inheritdoc />
    public override double ValueAt(double time)
    {
        var omega = SpeedAt(time);
        var theta = AngleAt(time);
        var alpha = time > Start && time < Start + Over ? AngularAcceleration : 0.0;
        return omega * omega * Math.Cos(theta) + alpha * Math.Sin(theta);
    }

    /// <inheritdoc />
    public override IEnumerable<double> Breakpoints => [Start, Start + Over];
}
