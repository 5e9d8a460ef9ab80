using System.Collections.Immutable;
using System.Runtime.InteropServices;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.Transient;

/// <summary>A recorded quantity as a linear functional of the state plus known support-motion terms.</summary>
/// <param name="Name">Mass, spring, damper or support name.</param>
/// <param name="Quantity">What the functional measures.</param>
/// <param name="Displacement">Weights on u (index, weight).</param>
/// <param name="Velocity">Weights on u̇.</param>
/// <param name="Acceleration">Weights on ü.</param>
/// <param name="Prescribed">Known terms: weight × function of time (support displacement or velocity).</param>
internal sealed record Probe(
    string Name,
    ResponseQuantity Quantity,
    (int Index, double Weight)[] Displacement,
    (int Index, double Weight)[] Velocity,
    (int Index, double Weight)[] Acceleration,
    (double Weight, TimeFunction Time)[] Prescribed)
{
    public string Unit => Quantity switch
    {
        ResponseQuantity.Displacement => Rotation ? "rad" : "m",
        ResponseQuantity.Velocity => Rotation ? "rad/s" : "m/s",
        ResponseQuantity.Acceleration => Rotation ? "rad/s^2" : "m/s^2",
        ResponseQuantity.PortVoltage => "V",
        ResponseQuantity.PortCurrent or ResponseQuantity.SourceCurrent => "A",
        _ when Direction is "rx" or "ry" or "rz" => "N*m",
        _ => "N",
    };

    /// <summary>Plane and 3d models: the probe reads a rotation DOF, so its motion is in rad, rad/s and rad/s².</summary>
    public bool Rotation { get; init; }

    /// <summary>Plane and 3d models: the direction label of a spring or damper force (<c>x</c> … <c>rz</c>, <c>axial</c>); null otherwise.</summary>
    public string? Direction { get; init; }

    public double Evaluate(double time, ReadOnlySpan<double> u, ReadOnlySpan<double> v, ReadOnlySpan<double> a)
    {
        var sum = 0.0;
        foreach (var (i, w) in Displacement) sum += w * u[i];
        foreach (var (i, w) in Velocity) sum += w * v[i];
        foreach (var (i, w) in Acceleration) sum += w * a[i];
        foreach (var (w, g) in Prescribed) sum += w * g.ValueAt(time);
        return sum;
    }

    /// <summary>The same functional in modal coordinates u = Φ q (weights become dense over the modes).</summary>
    public Probe ToModal(MathNet.Numerics.LinearAlgebra.Matrix<double> shapes)
    {
        (int, double)[] Convert((int Index, double Weight)[] weights)
        {
            if (weights.Length == 0) return [];
            var dense = new double[shapes.ColumnCount];
            foreach (var (i, w) in weights)
                for (var j = 0; j < dense.Length; j++) dense[j] += w * shapes[i, j];
            return [.. dense.Select((w, j) => (j, w))];
        }
        return this with { Displacement = Convert(Displacement), Velocity = Convert(Velocity), Acceleration = Convert(Acceleration) };
    }
}

/// <summary>Records probe histories, peaks, RMS and the energy balance while an integrator runs; no allocation per step.</summary>
internal sealed class ResponseRecorder : IStepSink
{
    /// <summary>The balance is closed every this many steps: T and V cost a product with M and K each.</summary>
    public const int BalanceEvery = 10;

    private readonly Probe[] _probes;
    private readonly int _recordEvery;
    private readonly double _rmsFrom;
    private readonly double _rmsTo;
    private readonly double _step;
    private readonly int _stepCount;
    private readonly IProgress<double>? _progress;
    private readonly int _progressEvery;
    private readonly double[] _times;
    private readonly double[][] _values;
    private int _recorded;
    private readonly double[] _peakValue;
    private readonly double[] _peakTime;
    private readonly double[] _sumSquares;
    private int _rmsSamples;

    private readonly SymmetricSparseMatrix _m;
    private readonly SymmetricSparseMatrix _c;
    private readonly SymmetricSparseMatrix _k;
    private readonly double[] _uOld;
    private readonly double[] _vOld;
    private readonly double[] _fOld;
    private double _initial, _work, _dissipated, _kinetic, _strain, _maxResidual, _scale;

    public ResponseRecorder(IReadOnlyList<Probe> probes, SymmetricSparseMatrix m, SymmetricSparseMatrix c, SymmetricSparseMatrix k,
        double step, int stepCount, int recordEvery, double rmsFrom, double rmsTo, IProgress<double>? progress)
    {
        _probes = [.. probes];
        _m = m;
        _c = c;
        _k = k;
        _step = step;
        _stepCount = stepCount;
        _recordEvery = recordEvery;
        _rmsFrom = rmsFrom;
        _rmsTo = rmsTo;
        _progress = progress;
        _progressEvery = Math.Max(1, stepCount / 200);
        // Exactly the samples that will be recorded, allocated once and handed to the result without a copy, so the
        // recorder's memory is the recorded histories themselves (probes × samples), whatever the number of DOFs.
        var records = stepCount / recordEvery + 1;
        _times = new double[records];
        _values = [.. _probes.Select(_ => new double[records])];
        _peakValue = new double[_probes.Length];
        _peakTime = new double[_probes.Length];
        _sumSquares = new double[_probes.Length];
        _uOld = new double[m.Size];
        _vOld = new double[m.Size];
        _fOld = new double[m.Size];
    }

    public void Accept(int step, double time, ReadOnlySpan<double> displacement, ReadOnlySpan<double> velocity,
        ReadOnlySpan<double> acceleration, ReadOnlySpan<double> force)
    {
        var record = step % _recordEvery == 0;
        var inWindow = time >= _rmsFrom - 1e-12 * _step && time <= _rmsTo + 1e-9 * _step;
        if (record) _times[_recorded] = time;
        for (var p = 0; p < _probes.Length; p++)
        {
            var value = _probes[p].Evaluate(time, displacement, velocity, acceleration);
            if (record) _values[p][_recorded] = value;
            if (Math.Abs(value) > Math.Abs(_peakValue[p]) || step == 0)
            {
                _peakValue[p] = value;
                _peakTime[p] = time;
            }
            if (inWindow) _sumSquares[p] += value * value;
        }
        if (inWindow) _rmsSamples++;
        if (record) _recorded++;

        AccountEnergy(step, displacement, velocity, force);
        displacement.CopyTo(_uOld);
        velocity.CopyTo(_vOld);
        force.CopyTo(_fOld);

        if (_progress is not null && (step % _progressEvery == 0 || step == _stepCount))
            _progress.Report((double)step / _stepCount);
    }

    /// <summary>W and D accumulate every step; T, V and the residual are evaluated every <see cref="BalanceEvery"/>-th step and at the end.</summary>
    private void AccountEnergy(int step, ReadOnlySpan<double> u, ReadOnlySpan<double> v, ReadOnlySpan<double> f)
    {
        if (step == 0)
        {
            _kinetic = 0.5 * _m.QuadraticForm(v);
            _strain = 0.5 * _k.QuadraticForm(u);
            _initial = _kinetic + _strain;
            _scale = _initial;
            return;
        }
        var work = 0.0;
        for (var i = 0; i < u.Length; i++) work += 0.5 * (_fOld[i] + f[i]) * (u[i] - _uOld[i]);
        _work += work;
        if (_c.NonZeros > 0) _dissipated += 0.25 * _step * _c.QuadraticFormOfSum(_vOld, v);
        if (step % BalanceEvery != 0 && step != _stepCount) return;
        _kinetic = 0.5 * _m.QuadraticForm(v);
        _strain = 0.5 * _k.QuadraticForm(u);
        var residual = _initial + _work - _kinetic - _strain - _dissipated;
        _scale = Math.Max(_scale, Math.Max(_kinetic + _strain + _dissipated, Math.Abs(_work)));
        _maxResidual = Math.Max(_maxResidual, Math.Abs(residual));
    }

    /// <summary>The recorded times in s; the recorder's own array when the run is complete (no copy).</summary>
    public ImmutableArray<double> Times => Recorded(_times);

    /// <summary>The recorded histories with peaks and RMS; each wraps the recorder's array when the run is complete (no copy).</summary>
    public ImmutableArray<ResponseHistory> Histories() =>
    [
        .. _probes.Select((p, i) => new ResponseHistory(
            p.Name, p.Quantity, p.Unit, Recorded(_values[i]), new Peak(_peakValue[i], _peakTime[i]),
            _rmsSamples > 0 ? Math.Sqrt(_sumSquares[i] / _rmsSamples) : double.NaN) { Direction = p.Direction }),
    ];

    private ImmutableArray<double> Recorded(double[] values) =>
        _recorded == values.Length ? ImmutableCollectionsMarshal.AsImmutableArray(values) : [.. values.AsSpan(0, _recorded)];

    /// <summary>Number of steps that fell inside the RMS window; 0 leaves every RMS not available (NaN).</summary>
    public int RmsSamples => _rmsSamples;

    public EnergyBalance Energy => new(_initial, _work, _kinetic, _strain, _dissipated,
        _scale > 0 ? _maxResidual / _scale : 0.0);
}
