using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using ModalChain.Io.Json;
using ModalChain.Io.Json.Records;
using ModalChain.TestSupport;

namespace ModalChain.Io.Tests.Json;

/// <summary>The one serializer of the output records: the number rule, which nulls are written, and what the derived
/// schemas state.</summary>
public class OutputJsonTests
{
    private static string Write<T>(T value) where T : class
    {
        using var stream = new MemoryStream();
        OutputJson.Write(stream, value);
        return Encoding.UTF8.GetString(stream.ToArray());
    }

    private static TuneMistuningOutput Point(double error, double peak, double atSpeeds) =>
        new() { FrequencyError = error, Peak = peak, PeakNote = double.IsFinite(peak) ? null : "unbounded", AtSpeeds = atSpeeds };

    // RFC 8259 §6: JSON numbers have no Infinity or NaN, so those are written as null (with the note beside them).
    [Fact]
    public void NonFiniteNumbers_AreWrittenAsNull_WithTheirNote()
    {
        var root = JsonNode.Parse(Write(Point(0.05, double.PositiveInfinity, double.NaN)))!.AsObject();
        Assert.Null(root["peak"]);
        Assert.True(root.ContainsKey("peak"));
        Assert.Equal("unbounded", root["peak_note"]!.GetValue<string>());
        Assert.Null(root["at_speeds"]);
        Assert.True(root.ContainsKey("at_speeds"));
    }

    // Round-trip identity (IEEE 754 binary64): the text written parses back to the same double; written the same under
    // de-DE (decimal comma) as under the invariant culture.
    [Theory]
    [InlineData(0.1)]
    [InlineData(1.0 / 3.0)]
    [InlineData(-2.5e-300)]
    [InlineData(123456789.125)]
    public void FiniteNumbers_ReadBackExactly_AndIgnoreTheCulture(double value)
    {
        var invariant = Write(Point(value, 1.5, 2));
        string german;
        using (new CultureScope("de-DE")) german = Write(Point(value, 1.5, 2));
        Assert.Equal(invariant, german);
        using var document = JsonDocument.Parse(invariant);
        var text = document.RootElement.GetProperty("frequency_error").GetRawText();
        Assert.Equal(value, double.Parse(text, CultureInfo.InvariantCulture));
        Assert.DoesNotContain(",5", invariant, StringComparison.Ordinal);
    }

    [Fact]
    public void AnOptionalNull_IsLeftOut_AndANullTheLayoutPromises_IsWritten()
    {
        var check = new CheckOutput
        {
            Title = "t",
            FormatVersion = JsonFormat.Version,
            Source = new() { File = "f.yaml", Sha256 = "00", ToolVersion = "0" },
            Passes = true,
            Separation = null,
            LoadCaseCombination = null,
            Limits = [new() { At = "deck", Quantity = "velocity", Measure = "rms", Unit = "m/s", Limit = 1, Value = 0.5, Reserve = 0.5, Passes = true }],
            MachineZones = [],
            FloorCurves = [],
            NotEvaluated = [],
            Caution = "c",
        };
        var root = JsonNode.Parse(Write(check))!.AsObject();
        Assert.True(root.ContainsKey("separation"));
        Assert.True(root.ContainsKey("load_case_combination"));
        var limit = root["limits"]![0]!.AsObject();
        Assert.False(limit.ContainsKey("measured_at"));
        Assert.False(limit.ContainsKey("reserve_note"));
        Assert.Equal(["title", "format_version", "source", "passes", "separation", "load_case_combination", "limits", "machine_zones", "floor_curves", "not_evaluated", "caution"],
            root.Select(p => p.Key));
    }

    [Fact]
    public void DerivedSchema_StatesRequiredFields_NullableNumbers_TheVersion_AndForbidsOtherFields()
    {
        var schema = JsonNode.Parse(OutputJson.Schema(new OutputSchemaFile("tune.schema.json", "tune", typeof(TuneOutput))))!.AsObject();
        Assert.False(schema["additionalProperties"]!.GetValue<bool>());
        var required = schema["required"]!.AsArray().Select(n => n!.GetValue<string>()).ToArray();
        Assert.Contains("peak_before", required);      // always written, null when no response was computed
        Assert.DoesNotContain("peak_before_note", required); // written only beside a null
        var properties = schema["properties"]!.AsObject();
        Assert.Equal(JsonFormat.Version, properties["format_version"]!["const"]!.GetValue<string>());
        Assert.Equal(["number", "null"], properties["peak_before"]!["type"]!.AsArray().Select(n => n!.GetValue<string>()));
        Assert.Equal("string", properties["peak_before_note"]!["type"]!.GetValue<string>());
        Assert.False(properties["absorber"]!["additionalProperties"]!.GetValue<bool>());
        Assert.Equal("Why the number beside it is null.", properties["peak_before_note"]!["description"]!.GetValue<string>());

        var check = JsonNode.Parse(OutputJson.Schema(new OutputSchemaFile("check.schema.json", "check", typeof(CheckOutput))))!["properties"]!;
        Assert.Equal(["sum", "rms", null], check["load_case_combination"]!["enum"]!.AsArray().Select(n => n?.GetValue<string>()));
    }

    // Peak memory: a long history goes to the stream while it is being written, not after the document is complete
    // (the serializer flushes its buffer between items of a sequence; common practice for System.Text.Json streams).
    [Fact]
    public void ALongHistory_ReachesTheStream_WhileItIsStillBeingWritten()
    {
        const int samples = 1_000_000;
        using var stream = new MemoryStream();
        long writtenBeforeLastSample = -1;
        IEnumerable<double> History()
        {
            for (var k = 0; k < samples - 1; k++) yield return k * 1e-3;
            writtenBeforeLastSample = stream.Length;
            yield return (samples - 1) * 1e-3;
        }
        var output = new TransientOutput
        {
            Title = "t",
            FormatVersion = JsonFormat.Version,
            Source = new() { File = "f.yaml", Sha256 = "00", ToolVersion = "0" },
            Method = "newmark",
            MethodDescription = "m",
            StepS = 1e-3,
            DurationS = 1e3,
            Steps = samples - 1,
            RecordEvery = 1,
            Loads = [],
            TimeS = History(),
            Responses = [],
            ElementForces = [],
            Reactions = [],
            RmsWindowS = new() { From = 0, To = 1e3 },
            Peaks = [],
            Energy = new() { InitialJ = 0, InputWorkJ = 0, FinalKineticJ = 0, FinalStrainJ = 0, DissipatedJ = 0, MaxRelativeError = 0 },
            Warnings = [],
            Caution = "c",
        };
        OutputJson.Write(stream, output);
        Assert.True(writtenBeforeLastSample > 0.95 * stream.Length,
            $"{writtenBeforeLastSample} of {stream.Length} bytes had reached the stream before the last sample was read");
    }
}
