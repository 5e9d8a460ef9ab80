using ModalChain.Io.Diagnostics;
using ModalChain.Io.Model;
using static ModalChain.Io.Tests.Model.ModelText;

namespace ModalChain.Io.Tests.Model;

/// <summary>
/// Every input error of the model format is reported at the line and column where it was written, with a message that
/// says what to change (issue 2, item 4). Positions are 1-based; a test's column is counted from its own text with
/// <see cref="ModelText.ColumnOf"/> so the expectation does not depend on the reader.
/// </summary>
public class ModelReaderValidationTests
{
    [Fact]
    public void UnknownNodeInBetween_IsReportedAtThatName_WithSuggestion()
    {
        const string line4 = "  s: {between: [ground, dek], stiffness: 3 kN/m}";
        var r = Read("masses:", "  deck: 3200 kg", "springs:", line4);
        SingleError(r, 4, ColumnOf(line4, "dek"), "unknown node 'dek'", "did you mean 'deck'?", "declare it under 'masses'");
    }

    [Fact]
    public void UnknownNodeInBlockSequence_IsReportedAtThatName()
    {
        var r = Read(
            "masses:",
            "  deck: 3200 kg",
            "springs:",
            "  columns:",
            "    between:",
            "      - ground",
            "      - roof",
            "    stiffness: 95 kN/mm");
        SingleError(r, 7, 9, "unknown node 'roof'");
    }

    [Fact]
    public void SpringFromANodeToItself_IsReportedAtItsBetweenList()
    {
        const string line4 = "  s: {between: [deck, deck], stiffness: 3 kN/m}";
        var r = Read("masses:", "  deck: 3200 kg", "springs:", line4);
        SingleError(r, 4, ColumnOf(line4, "["), "connects 'deck' to itself", "two ends must differ");
    }

    [Fact]
    public void GroundToGround_IsASpringToItself()
    {
        const string line4 = "  s: {between: [ground, ground], stiffness: 3 kN/m}";
        var r = Read("masses:", "  deck: 3200 kg", "springs:", line4);
        SingleError(r, 4, ColumnOf(line4, "["), "connects 'ground' to itself");
    }

    [Fact]
    public void MissingMass_IsReportedAtTheMassName_ForFlowAndBlockMappings()
    {
        var r = Read(
            "masses:",
            "  deck: {at: [0, 0]}",
            "  skid:",
            "    at: [0, 1.2]");
        Assert.Equal(2, r.Errors.Count());
        ErrorAt(r, 2, 3, "mass 'deck' needs 'mass'", "mass: 12 kg");
        ErrorAt(r, 3, 3, "mass 'skid' needs 'mass'");
    }

    [Theory]
    [InlineData("0 kg")]
    [InlineData("0")]
    [InlineData("-850 kg")]
    [InlineData("-0.5 t")]
    public void NonPositiveMass_IsReportedAtTheValue(string value)
    {
        var line2 = $"  skid: {{mass: {value}, at: [0, 1.2]}}";
        var r = Read("masses:", line2);
        SingleError(r, 2, ColumnOf(line2, value), "mass 'skid'", "must be positive");
    }

    [Fact]
    public void NegativeStiffness_IsReportedAtTheValue()
    {
        const string line4 = "  mounts: {between: [ground, skid], stiffness: -8.4 kN/mm}";
        var r = Read("masses:", "  skid: 850 kg", "springs:", line4);
        var d = SingleError(r, 4, ColumnOf(line4, "-8.4"), "'stiffness' of spring 'mounts'", "cannot be negative");
        Assert.Contains("-8400000 N/m", d.Message, StringComparison.Ordinal); // the SI value it was read as
    }

    [Fact]
    public void NegativeDamping_IsReportedAtTheValue()
    {
        const string line6 = "  loss: {between: [ground, skid], coefficient: -1.5 kN*s/m}";
        var r = Read("masses:", "  skid: 850 kg", "springs:", "  mounts: {between: [ground, skid], stiffness: 8.4 kN/mm}", "dampers:", line6);
        SingleError(r, 6, ColumnOf(line6, "-1.5"), "'coefficient' of damper 'loss'", "cannot be negative");
    }

    [Fact]
    public void ZeroStiffnessAndZeroDamping_AreAccepted()
    {
        // Zero is a legitimate value while sketching a model (a disconnected element); only a negative one is an error.
        var r = Read(
            "masses:", "  skid: 850 kg",
            "springs:", "  mounts: {between: [ground, skid], stiffness: 8.4 kN/mm}", "  spare: {between: [ground, skid], stiffness: 0 N/m}",
            "dampers:", "  loss: {between: [ground, skid], coefficient: 0}");
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
    }

    [Fact]
    public void StiffnessInKilograms_SaysKgIsAUnitOfMass()
    {
        const string line4 = "  mounts: {between: [ground, skid], stiffness: 3 kg}";
        var r = Read("masses:", "  skid: 850 kg", "springs:", line4);
        SingleError(r, 4, ColumnOf(line4, "3 kg"), "'kg' is a unit of mass", "a stiffness is expected", "accepted units: N/m, kN/m, N/mm, kN/mm, MN/m, lbf/in");
    }

    [Fact]
    public void MassInStiffnessUnits_SaysWhichQuantityTheUnitBelongsTo()
    {
        const string line2 = "  skid: 8.4 kN/mm";
        var r = Read("masses:", line2);
        SingleError(r, 2, ColumnOf(line2, "8.4"), "'kN/mm' is a unit of stiffness", "a mass is expected", "kg, g, t, lb");
    }

    [Fact]
    public void UnknownUnit_ListsTheAcceptedUnits()
    {
        const string line5 = "  loss: {between: [ground, skid], coefficient: 3 kN/s}";
        var r = Read("masses:", "  skid: 850 kg", "springs:", "  mounts: {between: [ground, skid], stiffness: 8.4 kN/mm}", line5.Replace("  loss", "dampers:\n  loss", StringComparison.Ordinal));
        SingleError(r, 6, ColumnOf(line5, "3 kN/s"), "unknown unit 'kN/s'", "damping coefficient", "N*s/m");
    }

    [Theory]
    [InlineData(".nan", "not a finite number")]
    [InlineData(".NaN", "not a finite number")]
    [InlineData(".inf", "not a finite number")]
    [InlineData("-.inf kg", "not a finite number")]
    [InlineData("1e400 kg", "not a finite number")]
    [InlineData("1e30 kg", "outside the plausible range")]
    [InlineData("1e-9 kg", "outside the plausible range")]
    public void NonFiniteOrAbsurdMass_IsReportedAtTheValue(string value, string says)
    {
        var line3 = $"  skid: {value}";
        var r = Read("masses:", "  deck: 3200 kg", line3, "springs:", "  s: {between: [ground, deck], stiffness: 1 kN/mm}", "  t: {between: [deck, skid], stiffness: 1 kN/mm}");
        var d = SingleError(r, 3, ColumnOf(line3, value), "mass 'skid'", says);
        if (says.StartsWith("outside", StringComparison.Ordinal)) Assert.Contains("check the number and its unit", d.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void AbsurdStiffness_IsReportedAtTheValue()
    {
        // 1e9 kN/mm = 1e15 N/m, beyond anything a lumped spring of a building structure carries (plausibility limit 1e14 N/m).
        const string line4 = "  s: {between: [ground, deck], stiffness: 1e9 kN/mm}";
        var r = Read("masses:", "  deck: 3200 kg", "springs:", line4);
        SingleError(r, 4, ColumnOf(line4, "1e9"), "outside the plausible range", "check the number and its unit");
    }

    [Fact]
    public void DecimalComma_SaysToWriteADecimalPoint()
    {
        const string line2 = "  deck: 3200,5 kg";
        var r = Read("masses:", line2);
        SingleError(r, 2, ColumnOf(line2, "3200,5"), "decimal comma", "'3200.5 kg'");
    }

    [Fact]
    public void DigitsGroupedWithSpaces_SayToWriteThemTogether()
    {
        const string line2 = "  deck: 3 200 kg";
        var r = Read("masses:", line2);
        SingleError(r, 2, ColumnOf(line2, "3 200"), "groups digits with spaces", "'3200 kg'");
    }

    [Fact]
    public void TextWhereANumberBelongs_IsReportedAtTheValue()
    {
        const string line2 = "  deck: {mass: heavy}";
        var r = Read("masses:", line2);
        SingleError(r, 2, ColumnOf(line2, "heavy"), "'heavy' is not a number with a unit", "12 kg");
    }

    [Fact]
    public void DuplicateMassName_IsReportedAtTheSecondKey()
    {
        var r = Read("masses:", "  deck: 3200 kg", "  skid: 850 kg", "  deck: 3300 kg");
        SingleError(r, 4, 3, "duplicate key 'deck'", "first defined at line 2", "must be unique");
    }

    [Fact]
    public void DuplicateSpringName_IsReportedAtTheSecondKey()
    {
        var r = Read(
            "masses:", "  deck: 3200 kg",
            "springs:",
            "  columns: {between: [ground, deck], stiffness: 95 kN/mm}",
            "  columns: {between: [ground, deck], stiffness: 90 kN/mm}");
        SingleError(r, 5, 3, "duplicate key 'columns'", "first defined at line 4");
    }

    [Fact]
    public void DuplicateKeyInsideAnElement_IsReportedAtTheSecondKey()
    {
        const string line2 = "  deck: {mass: 3200 kg, mass: 3300 kg}";
        var r = Read("masses:", line2);
        SingleError(r, 2, line2.LastIndexOf("mass", StringComparison.Ordinal) + 1, "duplicate key 'mass'");
    }

    [Theory]
    [InlineData("")]
    [InlineData("\n\n")]
    [InlineData("# only a comment\n")]
    [InlineData("---\n")]
    [InlineData("~\n")]
    public void EmptyFile_IsOneErrorAtTheStart(string text)
    {
        var r = ModelReader.Read(text, FileName);
        SingleError(r, 1, 1, "the model file is empty", "'masses'");
    }

    [Fact]
    public void EmptyMassesMapping_IsReportedAtItsValue()
    {
        var r = Read("title: t", "masses: {}");
        SingleError(r, 2, 9, "'masses' is empty", "at least one mass", "deck: 3200 kg");
    }

    [Fact]
    public void MassesWithNoValue_IsReportedAsEmpty()
    {
        var r = Read("title: t", "masses:", "springs:");
        // An absent value is marked by YamlDotNet just after the colon.
        SingleError(r, 2, 8, "'masses' is empty");
    }

    [Fact]
    public void MissingMasses_IsReportedAtTheStartOfTheFile()
    {
        var r = Read("title: A deck with nothing on it", "springs: {}");
        SingleError(r, 1, 1, "no 'masses' section");
    }

    [Fact]
    public void UnknownTopLevelKey_SuggestsTheNearestKey()
    {
        var r = Read("title: t", "masses:", "  deck: 3200 kg", "sprngs:", "  columns: {between: [ground, deck], stiffness: 95 kN/mm}");
        SingleError(r, 4, 1, "unknown key 'sprngs'", "did you mean 'springs'?", "accepted keys: title, masses, ");
    }

    [Fact]
    public void MisspeltMasses_IsBothUnknownAndMissing()
    {
        var r = Read("title: t", "mases:", "  deck: 3200 kg");
        Assert.Equal(2, r.Errors.Count());
        ErrorAt(r, 1, 1, "no 'masses' section");
        ErrorAt(r, 2, 1, "unknown key 'mases'", "did you mean 'masses'?");
    }

    [Fact]
    public void UnknownKeyInsideASpring_SuggestsTheNearestKey_AndTheMissingOneIsReportedAtTheName()
    {
        const string line4 = "  columns: {between: [ground, deck], stifness: 95 kN/mm}";
        var r = Read("masses:", "  deck: 3200 kg", "springs:", line4);
        Assert.Equal(2, r.Errors.Count());
        ErrorAt(r, 4, 3, "spring 'columns' needs 'stiffness'");
        ErrorAt(r, 4, ColumnOf(line4, "stifness"), "unknown key 'stifness' in spring 'columns'", "did you mean 'stiffness'?", "accepted keys: between, stiffness");
    }

    [Fact]
    public void UnknownKeyInsideAMass_ListsTheAcceptedKeys()
    {
        const string line2 = "  deck: {mass: 3200 kg, colour: grey}";
        var r = Read("masses:", line2);
        SingleError(r, 2, ColumnOf(line2, "colour"), "unknown key 'colour' in mass 'deck'", "accepted keys: mass, at");
    }

    [Fact]
    public void UnknownKeyInsideADamper_SuggestsTheNearestKey()
    {
        const string line6 = "  loss: {between: [ground, deck], coeficient: 1 kN*s/m}";
        var r = Read("masses:", "  deck: 3200 kg", "springs:", "  s: {between: [ground, deck], stiffness: 1 kN/mm}", "dampers:", line6);
        ErrorAt(r, 6, ColumnOf(line6, "coeficient"), "did you mean 'coefficient'?");
    }

    [Fact]
    public void GroundAsAMassName_IsReportedAtTheName()
    {
        var r = Read("masses:", "  deck: 3200 kg", "  ground: 100 kg");
        SingleError(r, 3, 3, "'ground' is the reserved fixed support", "cannot name a mass");
    }

    [Fact]
    public void BetweenWithThreeNodes_IsReportedAtTheList()
    {
        const string line4 = "  s: {between: [ground, deck, deck], stiffness: 1 kN/mm}";
        var r = Read("masses:", "  deck: 3200 kg", "springs:", line4);
        SingleError(r, 4, ColumnOf(line4, "["), "exactly two nodes", "[ground, deck]");
    }

    [Fact]
    public void MissingBetween_IsReportedAtTheSpringName()
    {
        var r = Read("masses:", "  deck: 3200 kg", "springs:", "  columns:", "    stiffness: 95 kN/mm");
        SingleError(r, 4, 3, "spring 'columns' needs 'between: [node, node]'");
    }

    [Fact]
    public void MalformedDrawingPosition_IsReportedAtTheValue()
    {
        const string line2 = "  deck: {mass: 3200 kg, at: [0, 0, 0]}";
        var r = Read("masses:", line2);
        SingleError(r, 2, ColumnOf(line2, "[0, 0, 0]"), "'at' of mass 'deck' must be a drawing position [x, y] in m");
    }

    [Fact]
    public void ListAsAMassValue_ShowsBothAcceptedForms()
    {
        const string line2 = "  deck: [3200]";
        var r = Read("masses:", line2, "springs:", "  s: {between: [ground, deck], stiffness: 1 kN/mm}");
        // One error only: 'deck' is still known as a node, so the spring naming it adds no "unknown node".
        SingleError(r, 2, ColumnOf(line2, "["), "'3200 kg'", "{mass: 3200 kg, at: [0, 0]}");
    }

    [Fact]
    public void SpringWrittenAsAPlainValue_ShowsTheMappingToWrite()
    {
        const string line4 = "  columns: 95 kN/mm";
        var r = Read("masses:", "  deck: 3200 kg", "springs:", line4);
        SingleError(r, 4, ColumnOf(line4, "95"), "spring 'columns' must be a mapping", "{between: [ground, deck], stiffness: 95 kN/mm}");
    }

    [Fact]
    public void DamperWrittenAsAList_ShowsTheMappingToWrite()
    {
        const string line6 = "  loss: [ground, deck]";
        var r = Read("masses:", "  deck: 3200 kg", "springs:", "  c: {between: [ground, deck], stiffness: 1 kN/mm}", "dampers:", line6);
        SingleError(r, 6, ColumnOf(line6, "["), "damper 'loss' must be a mapping", "coefficient: 1.5 kN*s/m");
    }

    [Fact]
    public void SectionWrittenAsAList_IsReportedAtTheList()
    {
        var r = Read("masses:", "  deck: 3200 kg", "springs:", "  - columns");
        SingleError(r, 4, 3, "'springs' must be a mapping");
    }

    [Fact]
    public void NodeNamesAreCaseSensitive_AndTheSuggestionSaysSo()
    {
        const string line4 = "  c: {between: [Ground, deck], stiffness: 1 kN/mm}";
        var r = Read("masses:", "  deck: 3200 kg", "springs:", line4);
        SingleError(r, 4, ColumnOf(line4, "Ground"), "unknown node 'Ground'", "did you mean 'ground'?");
    }

    [Theory]
    [InlineData("8.4 mm", "'mm' is a unit of length")]
    [InlineData("8.4 Hz", "'Hz' is a unit of frequency")]
    [InlineData("8.4 kN*s/m", "'kN*s/m' is a unit of damping coefficient")]
    [InlineData("8.4 kn/mm", "unknown unit 'kn/mm'")]
    public void StiffnessWithTheWrongUnit_NamesTheUnitsQuantity(string value, string says)
    {
        var line4 = $"  c: {{between: [ground, deck], stiffness: {value}}}";
        var r = Read("masses:", "  deck: 3200 kg", "springs:", line4);
        SingleError(r, 4, ColumnOf(line4, value), says, "accepted units: N/m");
    }

    [Fact]
    public void RootThatIsNotAMapping_IsReportedAtTheStart()
    {
        var r = Read("- deck", "- skid");
        SingleError(r, 1, 1, "the model file must be a mapping");
    }

    [Fact]
    public void SecondYamlDocument_IsReportedAtItsMarker()
    {
        var r = Read("masses:", "  deck: 3200 kg", "---", "masses:", "  skid: 850 kg");
        SingleError(r, 3, 1, "one YAML document", "remove the second '---'");
    }

    [Fact]
    public void UnreadableName_IsReportedAtTheName()
    {
        var r = Read("masses:", "  'deck 1': 3200 kg");
        SingleError(r, 2, 3, "'deck 1' is not a usable mass name");
    }

    [Fact]
    public void MissingFile_IsADiagnosticNotAnException()
    {
        var path = Path.Combine(Path.GetTempPath(), $"modalchain-missing-{Guid.NewGuid():N}.yaml");
        var r = ModelReader.ReadFile(path);
        Assert.False(r.Succeeded);
        var d = Assert.Single(r.Errors);
        Assert.Equal($"{path}:1:1: error: file not found", d.ToString());
    }

    [Fact]
    public void SeveralProblems_AreAllReportedAtOnce_InFileOrder()
    {
        // The dampers section comes first in the file but is read last: the report must still be in file order.
        string[] lines =
        [
            "title: Several mistakes",                                                  // 1
            "dampers:",                                                                 // 2
            "  loss: {between: [deck, skid], coefficient: -2 kN*s/m}",                  // 3  negative damping
            "masses:",                                                                  // 4
            "  deck: 3200 kg",                                                          // 5
            "  skid: {mass: 0 kg, at: [0, 1.2]}",                                       // 6  zero mass
            "  ground: 10 kg",                                                          // 7  reserved name
            "  deck: 3300 kg",                                                          // 8  duplicate
            "springs:",                                                                 // 9
            "  columns: {between: [ground, dek], stiffness: 95 kN/mm}",                 // 10 unknown node
            "  mounts: {between: [deck, skid], stiffness: 8.4 kg}",                     // 11 wrong unit
            "  loop: {between: [skid, skid], stiffness: 1 kN/mm}",                      // 12 self
            "colour: blue",                                                             // 13 unknown key
        ];
        var r = Read(lines);
        Assert.False(r.Succeeded);
        var expected = new (int Line, int Column, string Says)[]
        {
            (3, ColumnOf(lines[2], "-2"), "cannot be negative"),
            (6, ColumnOf(lines[5], "0 kg"), "must be positive"),
            (7, 3, "reserved fixed support"),
            (8, 3, "duplicate key 'deck'"),
            (10, ColumnOf(lines[9], "dek"), "unknown node 'dek'"),
            (11, ColumnOf(lines[10], "8.4 kg"), "'kg' is a unit of mass"),
            (12, ColumnOf(lines[11], "[skid"), "to itself"),
            (13, 1, "unknown key 'colour'"),
        };
        var errors = r.Errors.ToList();
        Assert.True(errors.Count == expected.Length, "got:\n" + string.Join("\n", errors));
        for (var i = 0; i < expected.Length; i++)
        {
            var (line, column, says) = expected[i];
            Assert.Equal($"{FileName}:{line}:{column}: error: ", errors[i].ToString()[..$"{FileName}:{line}:{column}: error: ".Length]);
            Assert.Contains(says, errors[i].Message, StringComparison.Ordinal);
        }
        Assert.Equal(r.Diagnostics.OrderBy(d => d.Position.Line).ThenBy(d => d.Position.Column).ToArray(), r.Diagnostics.ToArray());
    }
}
