using System.Text.Json;
using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>
/// 'outputs' of 'harmonic' and 'transient' on plane and 3d models name masses, bodies and DOF labels, and 'initial' names a
/// translation DOF label, as `--output` on the command line does (the file took mass names only before, and a body's
/// starting state could not be given).
/// </summary>
public class SpatialOutputsAndInitialTests
{
    private static string Skid(string harmonicOutputs, string transient)
    {
        var text = File.ReadAllText(CliRun.ModelPath("compressor-skid-deck.yaml"))
            .Replace("  outputs: [deck]\n", $"  outputs: {harmonicOutputs}\n", StringComparison.Ordinal);
        var start = text.IndexOf("transient:\n", StringComparison.Ordinal);
        var end = text.IndexOf("\n\n", start, StringComparison.Ordinal);
        text = text[..start] + transient + text[end..];
        var path = Path.Combine(Path.GetTempPath(), "mc-spatial-io-" + Guid.NewGuid().ToString("N") + ".yaml");
        File.WriteAllText(path, text);
        return path;
    }

    [Fact]
    public void BodyAndDofLabelOutputs_AndABodyStartingState_AreRead_AndTheRunStartsFromIt()
    {
        var path = Skid("[skid, deck]", "transient:\n  duration: 0.2 s\n  step: 1 ms\n  outputs: [skid.z, skid.rx]\n  initial: {skid.z: {displacement: 2 mm}}");
        try
        {
            var harmonic = CliRun.Run("harmonic", path, "--format", "json");
            Assert.True(harmonic.ExitCode == 0, harmonic.ToString());
            using (var doc = JsonDocument.Parse(harmonic.Stdout))
            {
                var dofs = doc.RootElement.GetProperty("peaks").EnumerateArray().Select(p => p.GetProperty("dof").GetString()!).Distinct().ToArray();
                // A body stands for its six DOFs (identity of the output expansion), the deck for its one.
                Assert.Equal(["skid.x", "skid.y", "skid.z", "skid.rx", "skid.ry", "skid.rz", "deck"], dofs);
            }
            var transient = CliRun.Run("transient", path, "--format", "json");
            Assert.True(transient.ExitCode == 0, transient.ToString());
            using (var doc = JsonDocument.Parse(transient.Stdout))
            {
                var z = doc.RootElement.GetProperty("responses").EnumerateArray()
                    .Single(r => r.GetProperty("dof").GetString() == "skid.z" && r.GetProperty("quantity").GetString() == "displacement");
                // The recorded history starts at the stated initial displacement (identity).
                NumericAssert.Close(0.002, z.GetProperty("values")[0].GetDouble(), Tolerance.Rel(1e-12), "skid.z at t = 0");
                Assert.Equal(["skid.z", "skid.rx"], doc.RootElement.GetProperty("responses").EnumerateArray()
                    .Select(r => r.GetProperty("dof").GetString()!).Distinct().ToArray());
            }
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Theory]
    [InlineData("skid", "'initial' of 'transient' names 'skid', which is not a translation DOF label")]
    [InlineData("skid.rx", "'initial' of 'transient' names 'skid.rx', which is not a translation DOF label")]
    public void ABodyOrARotationAsStartingState_IsALocatedError(string name, string message)
    {
        var path = Skid("[deck]", $"transient:\n  duration: 0.2 s\n  step: 1 ms\n  initial: {{{name}: {{displacement: 2 mm}}}}");
        try
        {
            var run = CliRun.Run("validate", path);
            Assert.Equal(2, run.ExitCode);
            Assert.Contains(message, run.Stderr, StringComparison.Ordinal);
            Assert.Matches(@":\d+:\d+: error: ", run.Stderr);
        }
        finally
        {
            File.Delete(path);
        }
    }
}
