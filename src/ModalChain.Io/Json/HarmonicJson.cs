using System.Numerics;
using ModalChain.Core;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Json.Records;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Maps a harmonic result to its output record, <see cref="HarmonicOutput"/>, the JSON object of <c>modalchain harmonic --format json</c> (SI units).</summary>
/// <remarks>
/// Field names are a public contract: frequencies_hz, responses (dof, quantity, unit, magnitude, phase_deg),
/// reactions (support, magnitude, phase_deg), peaks, operating_points; further fields are additions (cases and
/// combination for a model with load cases). Phases are
/// in degrees in (−180, 180], of Re(A e^{iωt}) relative to the loads' phase reference. Plane and 3d models add
/// mount_forces (element, kind, direction, unit, magnitude, phase_deg, and over the sweep peak_magnitude and
/// peak_frequency_hz): the force (N) or moment (N*m) each spring and damper applies to its second end per direction.
/// With electrical nodes (<see cref="ElectricalLabels"/>) a node's quantities are flux_linkage (V*s), voltage (V) and
/// voltage_rate (V/s), an element with an end on one carries a current in A, and source_currents (support, A) and
/// transducer_ports (transducer, quantity voltage in V or current in A) are added. Every magnitude is the
/// peak (zero-to-peak) amplitude of the sinusoid, said by "amplitude": "peak" beside its unit; r.m.s. is peak/√2.
/// </remarks>
public static class HarmonicJson
{
    /// <summary>Writes one JSON object to <paramref name="stream"/>.</summary>
    public static void Write(Stream stream, ModelDocument document, HarmonicResult result, string toolVersion) =>
        OutputJson.Write(stream, Output(document, result, toolVersion));

    /// <summary>Writes the result of a model with load cases: the top-level sweep fields stay empty (no sweep applies every load at once); each case's sweep is under "cases" and their combination under "combination".</summary>
    public static void Write(Stream stream, ModelDocument document, LoadCaseResult result, string toolVersion) =>
        OutputJson.Write(stream, Output(document, result, toolVersion));

    /// <summary>The output record of a sweep of every load at once.</summary>
    public static HarmonicOutput Output(ModelDocument document, HarmonicResult result, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(result);
        var sweep = Sweep(result, document.Network, DofMap.RotationLabels(document.Network));
        return new()
        {
            Title = MarkupText.Clean(document.Network.Title),
            FormatVersion = JsonFormat.Version,
            Source = SourceOutput.Of(document, toolVersion),
            Method = sweep.Method,
            ModesUsed = sweep.ModesUsed,
            Loads = sweep.Loads,
            FrequenciesHz = sweep.FrequenciesHz,
            Responses = sweep.Responses,
            ElementForces = sweep.ElementForces,
            Reactions = sweep.Reactions,
            MountForces = sweep.MountForces,
            SourceCurrents = sweep.SourceCurrents,
            TransducerPorts = sweep.TransducerPorts,
            Transmissibility = sweep.Transmissibility,
            Peaks = sweep.Peaks,
            OperatingPoints = sweep.OperatingPoints,
            Notes = sweep.Notes,
            Cases = [],
            Combination = null,
            Warnings = [.. document.Warnings.Select(d => d.ToString()), .. result.Warnings],
            Caution = Cautions.Text,
        };
    }

    /// <summary>The output record of a model with load cases.</summary>
    public static HarmonicOutput Output(ModelDocument document, LoadCaseResult result, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(result);
        var first = result.Cases[0].Result;
        var rotation = DofMap.RotationLabels(document.Network);
        return new()
        {
            Title = MarkupText.Clean(document.Network.Title),
            FormatVersion = JsonFormat.Version,
            Source = SourceOutput.Of(document, toolVersion),
            Method = first.Method == HarmonicMethod.Modal ? "modal" : "direct",
            ModesUsed = first.ModesUsed,
            Loads = [.. result.Cases.SelectMany(c => c.Case.Loads).Distinct()],
            FrequenciesHz = [],
            Responses = [],
            ElementForces = [],
            Reactions = [],
            Transmissibility = [],
            Peaks = [],
            OperatingPoints = [],
            Notes = ["the model has load cases: each case is swept on its own under 'cases', and the cases are combined at their running speeds under 'combination'"],
            Cases = [.. result.Cases.Select(c =>
            {
                var sweep = Sweep(c.Result, document.Network, rotation);
                return new HarmonicCaseOutput
                {
                    Name = c.Case.Name,
                    Method = sweep.Method,
                    ModesUsed = sweep.ModesUsed,
                    Loads = sweep.Loads,
                    FrequenciesHz = sweep.FrequenciesHz,
                    Responses = sweep.Responses,
                    ElementForces = sweep.ElementForces,
                    Reactions = sweep.Reactions,
                    MountForces = sweep.MountForces,
                    SourceCurrents = sweep.SourceCurrents,
                    TransducerPorts = sweep.TransducerPorts,
                    Transmissibility = sweep.Transmissibility,
                    Peaks = sweep.Peaks,
                    OperatingPoints = sweep.OperatingPoints,
                    Notes = sweep.Notes,
                    Warnings = [.. c.Result.Warnings],
                };
            })],
            Combination = new()
            {
                Rule = LoadCaseSelection.Name(result.Rule),
                RuleDescription = LoadCaseSelection.Describe(result.Rule),
                Responses = [.. from r in result.Combined
                                from q in Enum.GetValues<ResponseQuantity>()
                                from rms in new[] { false, true }
                                let scale = rms ? 1 / Math.Sqrt(2) : 1
                                select new HarmonicCombinedOutput
                                {
                                    Dof = r.Dof,
                                    Quantity = ElectricalLabels.Quantity(document.Network, r.Dof, q),
                                    Unit = ElectricalLabels.Unit(document.Network, r.Dof, q, rotation(r.Dof)),
                                    Amplitude = rms ? "rms" : "peak",
                                    Magnitude = rms ? r.Rms(q, result.Rule) : r.Peak(q, result.Rule),
                                    Components = [.. r.Components.Select(c => new HarmonicComponentOutput
                                    {
                                        Case = c.Case,
                                        SpeedHz = c.SpeedHz,
                                        SpeedRpm = 60 * c.SpeedHz,
                                        Magnitude = scale * c.Peak(q),
                                    })],
                                }],
                Notes = [.. result.Notes],
            },
            Warnings = [.. document.Warnings.Select(d => d.ToString()),
                .. result.Cases.SelectMany(c => c.Result.Warnings.Select(warning => $"load case '{c.Case.Name}': {warning}"))],
            Caution = Cautions.Text,
        };
    }

    /// <summary>The fields of one sweep, from "method" to "notes" (a case record carrying them, used as a holder).</summary>
    private static HarmonicCaseOutput Sweep(HarmonicResult result, Network network, Func<string, bool> rotation)
    {
        var f = result.FrequenciesHz;
        return new()
        {
            Name = "",
            Warnings = [],
            Method = result.Method == HarmonicMethod.Modal ? "modal" : "direct",
            ModesUsed = result.ModesUsed,
            Loads = [.. result.Loads],
            FrequenciesHz = f,
            // Magnitudes and phases are computed as they are written, so no copy of the sweep is held.
            Responses = [.. from r in result.Responses
                            from q in Enum.GetValues<ResponseQuantity>()
                            select new HarmonicSeriesOutput
                            {
                                Dof = r.Dof,
                                Quantity = ElectricalLabels.Quantity(network, r.Dof, q),
                                Unit = ElectricalLabels.Unit(network, r.Dof, q, rotation(r.Dof)),
                                Amplitude = "peak",
                                Magnitude = Enumerable.Range(0, f.Length).Select(k => r.At(k, f[k], q).Magnitude),
                                PhaseDeg = Enumerable.Range(0, f.Length).Select(k => PhaseDegrees(r.At(k, f[k], q))),
                            }],
            ElementForces = [.. result.ElementForces.Select(e => new HarmonicElementSeriesOutput
            {
                Element = e.Element,
                Kind = Kind(e.Kind),
                Unit = ElectricalLabels.ElementUnit(network, e.Element, e.Kind == ElementKind.Spring),
                Amplitude = "peak",
                Magnitude = e.Force.Select(z => z.Magnitude),
                PhaseDeg = e.Force.Select(PhaseDegrees),
            })],
            Reactions = [.. result.Reactions.Select(r => new HarmonicReactionSeriesOutput
            {
                Support = r.Support,
                Unit = "N",
                Amplitude = "peak",
                Magnitude = r.Force.Select(z => z.Magnitude),
                PhaseDeg = r.Force.Select(PhaseDegrees),
            })],
            // Plane and 3d models only (line models keep their output unchanged): what each mount transmits per direction.
            MountForces = result.MountForces.IsEmpty ? null : [.. result.MountForcePeaks().Select(x => new HarmonicMountSeriesOutput
            {
                Element = x.Force.Element,
                Kind = Kind(x.Force.Kind),
                Direction = x.Force.Direction,
                Unit = x.Force.Unit,
                Amplitude = "peak",
                Magnitude = x.Force.Force.Select(z => z.Magnitude),
                PhaseDeg = x.Force.Force.Select(PhaseDegrees),
                PeakMagnitude = x.Magnitude,
                PeakFrequencyHz = x.FrequencyHz,
            })],
            SourceCurrents = result.SourceCurrents.IsEmpty ? null : [.. result.SourceCurrents.Select(c => new HarmonicSourceCurrentSeriesOutput
            {
                Support = c.Support,
                Unit = "A",
                Amplitude = "peak",
                Magnitude = c.Current.Select(z => z.Magnitude),
                PhaseDeg = c.Current.Select(PhaseDegrees),
            })],
            TransducerPorts = result.TransducerPorts.IsEmpty ? null : [.. from port in result.TransducerPorts
                from q in new[] { ("voltage", "V", port.Voltage), ("current", "A", port.Current) }
                select new HarmonicPortSeriesOutput
                {
                    Transducer = port.Transducer,
                    Quantity = q.Item1,
                    Unit = q.Item2,
                    Amplitude = "peak",
                    Magnitude = q.Item3.Select(z => z.Magnitude),
                    PhaseDeg = q.Item3.Select(PhaseDegrees),
                }],
            Transmissibility = [.. result.Transmissibilities.Select(t => new HarmonicTransmissibilityOutput { Kind = t.Kind, Dof = t.Dof, Reference = t.Reference, Ratio = t.Ratio })],
            Peaks = [.. result.Peaks().Select(p => new HarmonicPeakOutput
            {
                Dof = p.Dof,
                Quantity = ElectricalLabels.Quantity(network, p.Dof, p.Quantity),
                Unit = ElectricalLabels.Unit(network, p.Dof, p.Quantity, rotation(p.Dof)),
                Amplitude = "peak",
                Magnitude = p.Magnitude,
                FrequencyHz = p.FrequencyHz,
                RisingAt = TuneJson.Edge(p.RisingAt),
                EdgeMagnitude = p.EdgeMagnitude,
                IsInteriorPeak = p.IsInterior,
                Note = p.EdgeWarning,
            })],
            OperatingPoints = [.. result.OperatingPoints.Select(op => new HarmonicOperatingPointOutput
            {
                SpeedHz = op.SpeedHz,
                SpeedRpm = op.SpeedHz * 60,
                Loads = [.. op.Loads],
                Responses = [.. from r in op.Response.Responses
                                from q in Enum.GetValues<ResponseQuantity>()
                                let z = r.At(0, op.SpeedHz, q)
                                select new HarmonicPointOutput
                                {
                                    Dof = r.Dof,
                                    Quantity = ElectricalLabels.Quantity(network, r.Dof, q),
                                    Unit = ElectricalLabels.Unit(network, r.Dof, q, rotation(r.Dof)),
                                    Amplitude = "peak",
                                    Magnitude = z.Magnitude,
                                    PhaseDeg = PhaseDegrees(z),
                                }],
                ElementForces = [.. op.Response.ElementForces.Select(e => new HarmonicElementPointOutput
                {
                    Element = e.Element,
                    Kind = Kind(e.Kind),
                    Unit = ElectricalLabels.ElementUnit(network, e.Element, e.Kind == ElementKind.Spring),
                    Amplitude = "peak",
                    Magnitude = e.Force[0].Magnitude,
                    PhaseDeg = PhaseDegrees(e.Force[0]),
                })],
                Reactions = [.. op.Response.Reactions.Select(r => new HarmonicReactionPointOutput
                {
                    Support = r.Support,
                    Unit = "N",
                    Amplitude = "peak",
                    Magnitude = r.Force[0].Magnitude,
                    PhaseDeg = PhaseDegrees(r.Force[0]),
                })],
                SourceCurrents = op.Response.SourceCurrents.IsEmpty ? null : [.. op.Response.SourceCurrents.Select(c => Point(c.Support, "current", c.Current[0]))],
                TransducerPorts = op.Response.TransducerPorts.IsEmpty ? null : [.. op.Response.TransducerPorts.SelectMany(port =>
                    new[] { Point(port.Transducer, "voltage", port.Voltage[0]), Point(port.Transducer, "current", port.Current[0]) })],
                MountForces = op.Response.MountForces.IsEmpty ? null : [.. op.Response.MountForces.Select(m => new HarmonicMountPointOutput
                {
                    Element = m.Element,
                    Kind = Kind(m.Kind),
                    Direction = m.Direction,
                    Unit = m.Unit,
                    Amplitude = "peak",
                    Magnitude = m.Force[0].Magnitude,
                    PhaseDeg = PhaseDegrees(m.Force[0]),
                })],
            })],
            Notes = [.. result.Notes],
        };
    }

    private static HarmonicElectricalPointOutput Point(string name, string quantity, Complex z) => new()
    {
        Name = name,
        Quantity = quantity,
        Unit = quantity == "voltage" ? "V" : "A",
        Amplitude = "peak",
        Magnitude = z.Magnitude,
        PhaseDeg = PhaseDegrees(z),
    };

    private static string Kind(ElementKind kind) => kind == ElementKind.Spring ? "spring" : "damper";

    /// <summary>The JSON name of a quantity: "displacement", "velocity", "acceleration".</summary>
    public static string Name(ResponseQuantity q) => q.ToString().ToLowerInvariant();

    /// <summary>The SI unit of a quantity as written in JSON and CSV headers.</summary>
    /// <summary>The SI unit of <paramref name="q"/>: of an angle (rad, rad/s, rad/s^2) when <paramref name="rotation"/>.</summary>
    public static string Unit(ResponseQuantity q, bool rotation) => !rotation ? Unit(q) : q switch
    {
        ResponseQuantity.Displacement => "rad",
        ResponseQuantity.Velocity => "rad/s",
        _ => "rad/s^2",
    };

    public static string Unit(ResponseQuantity q) => q switch
    {
        ResponseQuantity.Displacement => "m",
        ResponseQuantity.Velocity => "m/s",
        _ => "m/s^2",
    };

    /// <summary>Phase of <paramref name="z"/> in degrees.</summary>
    public static double PhaseDegrees(Complex z) => z == Complex.Zero ? 0 : z.Phase * 180 / Math.PI;
}
