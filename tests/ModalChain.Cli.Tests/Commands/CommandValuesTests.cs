using System.Text.RegularExpressions;
using ModalChain.Core;
using ModalChain.TestSupport;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>The one rule for values on the command line (a number with an optional unit of the option's kind), and help that matches it.</summary>
public class CommandValuesTests
{
    private static readonly string Chiller = ModelPath("chiller-deck.yaml");
    private static readonly string Startup = ModelPath("fan-platform-startup.yaml");
    private static readonly string Mezzanine = ModelPath("mezzanine-fan-absorber-check.yaml");

    public static TheoryData<string[]> HelpPages() =>
    [
        ["--help"], ["validate", "--help"], ["modes", "--help"], ["check", "--help"], ["tune", "--help"],
        ["study", "--help"], ["harmonic", "--help"], ["transient", "--help"], ["report", "--help"],
    ];

    [Theory]
    [MemberData(nameof(HelpPages))]
    public void EveryHelpPage_CarriesTheCautionExactlyOnce(string[] args)
    {
        var o = Run(args);
        Assert.True(o.ExitCode == 0, o.ToString());
        var text = Unwrapped(o.Stdout);
        Assert.Single(Regex.Matches(text, Regex.Escape(Unwrapped(Cautions.Text))));
    }

    [Fact]
    public void TuneHelp_AlsoCarriesTheAbsorberCautionOnce_AndTheRootListingNeither()
    {
        var absorber = Unwrapped(Core.Analyses.Absorbers.AbsorberCaution.Text);
        Assert.Single(Regex.Matches(Unwrapped(Run("tune", "--help").Stdout), Regex.Escape(absorber)));
        Assert.Empty(Regex.Matches(Unwrapped(Run("--help").Stdout), Regex.Escape(absorber)));
    }

    [Theory]
    [InlineData("check", "--format <table|json>")]
    [InlineData("tune", "--format <table|json>")]
    [InlineData("modes", "--format <table|json|csv>")]
    [InlineData("harmonic", "--format <table|json|csv>")]
    [InlineData("transient", "--format <table|json|csv>")]
    [InlineData("study", "--format <table|json|csv>")]
    [InlineData("harmonic", "--method <direct|modal>")]
    [InlineData("transient", "--method <newmark|hht|exact|modal>")]
    [InlineData("report", "--format <html|svg|pdf>")]
    [InlineData("report", "--units <si|imperial>")]
    [InlineData("study", "--spacing <linear|geometric>")]
    [InlineData("tune", "--target <force|base|random-force|speed>")]
    public void Help_OffersOnlyWhatTheCommandAccepts_InLowerCase(string command, string usage)
    {
        var text = Run(command, "--help").Stdout;
        Assert.Contains(usage, text, StringComparison.Ordinal);
        Assert.DoesNotMatch(@"<[A-Z][a-z]+\|", text); // no enum member names such as <Direct|Modal>
        Assert.DoesNotContain("[default: ", text, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("check", "csv")]
    [InlineData("tune", "csv")]
    public void AFormatTheHelpDoesNotOffer_IsRefused(string command, string format)
    {
        string[] extra = command == "tune" ? ["--host", "deck", "--mass-ratio", "5 %"] : [];
        var o = Run([command, Mezzanine, .. extra, "--format", format]);
        Assert.Equal(ExitCodes.InputError, o.ExitCode);
        Assert.Equal("", o.Stdout);
    }

    [Theory]
    [InlineData("harmonic", "--from", "a bare number is in Hz")]
    [InlineData("harmonic", "--to", "a bare number is in Hz")]
    [InlineData("tune", "--speed", "a bare number is in Hz")]
    [InlineData("tune", "--mass-ratio", "a bare number is a fraction")]
    [InlineData("report", "--mass-ratio", "a bare number is a fraction")]
    [InlineData("transient", "--step", "a bare number is in s")]
    [InlineData("transient", "--duration", "a bare number is in s")]
    [InlineData("study", "--from", "a bare number is in the field's SI unit")]
    [InlineData("study", "--to", "a bare number is in the field's SI unit")]
    public void EveryQuantityOption_StatesTheUnitOfABareNumber(string command, string option, string rule)
    {
        var text = Unwrapped(Run(command, "--help").Stdout);
        var at = text.IndexOf(option + " <", StringComparison.Ordinal);
        Assert.True(at >= 0, $"{option} is not in the help of {command}");
        var next = text.IndexOf(" --", at + option.Length, StringComparison.Ordinal);
        Assert.Contains(rule, text[at..(next < 0 ? text.Length : next)], StringComparison.Ordinal);
    }

    [Fact]
    public void Harmonic_FrequenciesTakeAUnitOrABareNumberInHz_WithTheSameResult()
    {
        // 1800 rpm = 30 Hz exactly (definition of rpm).
        var bare = Run("harmonic", Chiller, "--from", "20", "--to", "30", "--points", "3", "--format", "json");
        var units = Run("harmonic", Chiller, "--from", "20 Hz", "--to", "1800 rpm", "--points", "3", "--format", "json");
        Assert.True(bare.ExitCode == 0, bare.ToString());
        Assert.True(units.ExitCode == 0, units.ToString());
        Assert.Equal(bare.Stdout, units.Stdout);
    }

    [Theory]
    [InlineData("harmonic", "--from", "20 kg", "a frequency is expected")]
    [InlineData("harmonic", "--to", "3 s", "a frequency is expected")]
    [InlineData("transient", "--step", "1 Hz", "a time is expected")]
    [InlineData("transient", "--duration", "6 m", "a time is expected")]
    [InlineData("tune", "--speed", "5 kN", "a frequency is expected")]
    [InlineData("tune", "--mass-ratio", "5 kg", "a ratio is expected")]
    [InlineData("report", "--mass-ratio", "5 kg", "a ratio is expected")]
    public void AUnitOfTheWrongKind_ExitsTwo_NamingTheKindExpected(string command, string option, string value, string message)
    {
        string[] extra = command switch
        {
            "tune" => option == "--mass-ratio" ? ["--host", "deck"] : ["--host", "deck", "--mass-ratio", "5 %"],
            "report" => ["-o", Path.Combine(Path.GetTempPath(), "modalchain-never-written"), "--absorber-host", "deck"],
            _ => [],
        };
        var model = command == "transient" ? Startup : Mezzanine;
        var o = Run([command, model, .. extra, option, value]);
        Assert.Equal(ExitCodes.InputError, o.ExitCode);
        Assert.Equal("", o.Stdout);
        Assert.Contains($"{option} '{value}'", o.Stderr, StringComparison.Ordinal);
        Assert.Contains(message, o.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Study_AUnitOfTheWrongKind_ExitsTwo_NamingTheFieldsKind()
    {
        var o = Run("study", Mezzanine, "--vary", "springs.beams.stiffness", "--from", "30 Hz", "--to", "100 kN/mm");
        Assert.Equal(ExitCodes.InputError, o.ExitCode);
        Assert.Contains("a stiffness is expected", o.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Study_ABareNumberIsInTheFieldsSiUnit_AndTheOutputSaysSo()
    {
        // 3e7 N/m = 30 kN/mm (kN/mm = 1e6 N/m by definition).
        var bare = Run("study", Mezzanine, "--vary", "springs.beams.stiffness", "--from", "3e7", "--to", "1.2e8", "--steps", "3", "--format", "json");
        var units = Run("study", Mezzanine, "--vary", "springs.beams.stiffness", "--from", "30 kN/mm", "--to", "120 kN/mm", "--steps", "3", "--format", "json");
        Assert.True(bare.ExitCode == 0, bare.ToString());
        Assert.Equal(units.Stdout, bare.Stdout);
        Assert.Contains("--from 3e7 has no unit; read as 3E+07 N/m (the SI unit of springs.beams.stiffness)", bare.Stderr, StringComparison.Ordinal);
        Assert.Contains("\"unit\": \"N/m\"", bare.Stdout, StringComparison.Ordinal);
        // The table shows the varied stiffness in the unit the file writes stiffness in (kN/mm), as every table does,
        // whatever unit --from was typed in: 3e7 N/m is its first value, 30.
        var table = Run("study", Mezzanine, "--vary", "springs.beams.stiffness", "--from", "3e7", "--to", "1.2e8", "--steps", "3");
        Assert.Contains("springs.beams.stiffness [kN/mm]", table.Stdout, StringComparison.Ordinal);
        Assert.Matches(@"\n\s+30\s+\d", table.Stdout);
    }

    [Theory]
    [InlineData("harmonic", "--points", "2.5")]
    [InlineData("harmonic", "--points", "1")]
    [InlineData("study", "--steps", "many")]
    [InlineData("modes", "--count", "0")]
    [InlineData("report", "--modes", "many")]
    [InlineData("tune", "--mode", "1.5")]
    public void ACountThatIsNotAWholeNumberInRange_ExitsTwo(string command, string option, string value)
    {
        string[] extra = command switch
        {
            "tune" => ["--host", "deck", "--mass-ratio", "5 %"],
            "report" => ["-o", Path.Combine(Path.GetTempPath(), "modalchain-never-written")],
            "study" => ["--vary", "speed", "--from", "0 rpm", "--to", "3000 rpm"],
            _ => [],
        };
        var o = Run([command, Mezzanine, .. extra, option, value]);
        Assert.Equal(ExitCodes.InputError, o.ExitCode);
        Assert.Contains($"{option} must be a whole number", o.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", o.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Choices_AreAcceptedIgnoringCase()
    {
        var lower = Run("harmonic", Chiller, "--method", "modal", "--points", "3", "--format", "json");
        var upper = Run("harmonic", Chiller, "--method", "MODAL", "--points", "3", "--format", "JSON");
        Assert.True(upper.ExitCode == 0, upper.ToString());
        Assert.Equal(lower.Stdout, upper.Stdout);
        Assert.Contains("\"method\": \"modal\"", upper.Stdout, StringComparison.Ordinal);
        var target = Run("tune", Mezzanine, "--host", "deck", "--mass-ratio", "5 %", "--target", "Base", "--method", "Den-Hartog", "--format", "json");
        Assert.True(target.ExitCode == 0, target.ToString());
        Assert.Contains("\"target\": \"base", target.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_KeepsTheUnitTheUserWrote_ForDisplay()
    {
        var v = Cli.Commands.CommandValues.Read(" 95 kN/mm ", Core.Units.Quantity.Stiffness, "--from", Cli.Commands.ValueBound.Any, out var error);
        Assert.Null(error);
        NumericAssert.Close(95e6, v!.Si, Tolerance.Rel(1e-15), "95 kN/mm in N/m");
        Assert.Equal("kN/mm", v.Unit);
        Assert.False(v.Bare);
        Assert.Equal("95 kN/mm", v.Show(v.Si));
    }
}
