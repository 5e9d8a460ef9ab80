using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Io.Model;

namespace ModalChain.Io.Tests.Model;

/// <summary>Reading 'load-cases' and the 'cases' and 'combine' keys of 'harmonic'.</summary>
public class LoadCaseReaderTests
{
    private const string Network = """
        masses:
          deck: {mass: 3200 kg, at: [0, 0]}
          skid: {mass: 850 kg, at: [0, 1.2]}
          pump: {mass: 400 kg, at: [1, 1.2]}
        springs:
          columns: {between: [ground, deck], stiffness: 95 kN/mm}
          mounts: {between: [deck, skid], stiffness: 8.4 kN/mm}
          pump-mounts: {between: [deck, pump], stiffness: 3 kN/mm}
        loads:
          fan-unbalance: {kind: unbalance, at: skid, mass-radius: 12 kg*mm, speed: 1480 rpm}
          fan-misalignment: {kind: force, at: skid, amplitude: 40 N, speed: 49.3 Hz}
          pump-unbalance: {kind: unbalance, at: pump, mass-radius: 4 kg*mm, speed: 2960 rpm}
          start-up: {kind: force, at: skid, time: {kind: step, value: 2 kN, at: 0.05 s}}

        """;

    private static LoadResult Read(string text) => ModelReader.Read(Network + text, "cases.yaml");

    private static string Errors(LoadResult result) => string.Join("\n", result.Errors.Select(e => e.ToString()));

    [Fact]
    public void ListsAndMappings_BothDeclareACase_AndEveryCaseIsSweptBySumByDefault()
    {
        var result = Read("""
            load-cases:
              fan: [fan-unbalance, fan-misalignment]
              pump: {loads: [pump-unbalance]}
            harmonic:
              frequencies: {from: 1 Hz, to: 60 Hz}
            """);
        Assert.True(result.Succeeded, Errors(result));
        var document = result.Model!;
        Assert.Equal(["fan", "pump"], document.LoadCases.Select(c => c.Name));
        Assert.Equal(["fan-unbalance", "fan-misalignment"], document.LoadCases[0].Loads.ToArray());
        Assert.Equal(["pump-unbalance"], document.LoadCases[1].Loads.ToArray());
        Assert.NotNull(document.Cases);
        Assert.Equal(CaseCombination.Sum, document.Cases!.Rule);
        Assert.Equal(["fan", "pump"], document.Cases.Cases.Select(c => c.Name));
        Assert.Equal(3, OperatingLoads.Of(document).Count);
    }

    [Fact]
    public void CasesAndCombine_ChooseTheCasesAndTheRule()
    {
        var result = Read("""
            load-cases:
              fan: [fan-unbalance]
              pump: [pump-unbalance]
            harmonic:
              cases: [pump]
              combine: rms
              frequencies: {from: 1 Hz, to: 60 Hz}
            """);
        Assert.True(result.Succeeded, Errors(result));
        Assert.Equal(CaseCombination.Rms, result.Model!.Cases!.Rule);
        Assert.Equal(["pump"], result.Model.Cases.Cases.Select(c => c.Name));
        Assert.Equal(["pump-unbalance"], OperatingLoads.Of(result.Model).Select(l => l.Name));
    }

    [Fact]
    public void AModelWithoutLoadCases_HasNone()
    {
        var result = Read("harmonic:\n  frequencies: {from: 1 Hz, to: 60 Hz}\n");
        Assert.True(result.Succeeded, Errors(result));
        Assert.Null(result.Model!.Cases);
        Assert.Empty(result.Model.LoadCases);
    }

    [Theory]
    [InlineData("load-cases:\n  fan: [start-up]\n", "cases.yaml:15:9: error: load case 'fan' names 'start-up', which has a 'time' function")]
    [InlineData("load-cases:\n  fan: [fan-unbalance, fan-unbalance]\n", "cases.yaml:15:24: error: load case 'fan' names 'fan-unbalance' twice")]
    [InlineData("load-cases:\n  fan: fan-unbalance\n", "cases.yaml:15:8: error: load case 'fan' must be a list of load names")]
    [InlineData("load-cases:\n  fan: {loads: [fan-unbalance], combine: rms}\n", "cases.yaml:15:33: error: unknown key 'combine' in load case 'fan'")]
    [InlineData("load-cases: {}\n", "cases.yaml:14:13: error: 'load-cases' declares no case")]
    [InlineData("load-cases:\n  ground: [fan-unbalance]\n", "cases.yaml:15:3: error: 'ground' is the reserved fixed support and cannot name a load case")]
    [InlineData("harmonic:\n  combine: sum\n  frequencies: {from: 1 Hz, to: 60 Hz}\n", "cases.yaml:15:12: error: 'combine' of 'harmonic' combines load cases, but the model has no 'load-cases'")]
    [InlineData("harmonic:\n  cases: [fan]\n  frequencies: {from: 1 Hz, to: 60 Hz}\n", "cases.yaml:15:10: error: 'cases' of 'harmonic' chooses load cases, but the model has no 'load-cases' section")]
    public void BadLoadCases_AreLocatedErrors(string text, string expected)
    {
        var result = Read(text);
        Assert.False(result.Succeeded);
        Assert.True(result.Errors.Any(e => e.ToString().StartsWith(expected, StringComparison.Ordinal)), Errors(result));
    }
}
