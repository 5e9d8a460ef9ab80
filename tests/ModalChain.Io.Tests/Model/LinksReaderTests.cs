using ModalChain.Io.Model;

namespace ModalChain.Io.Tests.Model;

/// <summary>The 'links' section: masses tied rigidly, with located errors for every misuse.</summary>
public class LinksReaderTests
{
    private const string Network = """
        masses:
          deck: 3200 kg
          skid: 850 kg
          frame: 120 kg
        supports:
          plinth:
        springs:
          columns: {between: [ground, deck], stiffness: 95 kN/mm}
          mounts:  {between: [deck, skid], stiffness: 8.4 kN/mm}

        """;

    private static LoadResult Read(string links) => ModelReader.Read(Network + links, "m.yaml");

    private static void AssertError(LoadResult result, int line, int column, string fragment)
    {
        Assert.False(result.Succeeded);
        Assert.Contains(result.Errors, d => d.Position.Line == line && d.Position.Column == column && d.Message.Contains(fragment, StringComparison.Ordinal));
    }

    [Fact]
    public void ALink_IsReadIntoTheNetwork()
    {
        var result = Read("links:\n  skid-on-frame: [skid, frame]\n");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var link = Assert.Single(result.Model!.Network.Links);
        Assert.Equal("skid-on-frame", link.Name);
        Assert.Equal(new[] { "skid", "frame" }, link.Masses.ToArray());
    }

    [Fact]
    public void AnUnknownMass_IsALocatedErrorWithASuggestion()
    {
        AssertError(Read("links:\n  tie: [skid, fram]\n"), 11, 15, "unknown mass 'fram' (did you mean 'frame'?)");
    }

    [Fact]
    public void ALinkToItself_IsALocatedError()
    {
        AssertError(Read("links:\n  tie: [skid, skid]\n"), 11, 15, "ties 'skid' to itself");
    }

    [Fact]
    public void LinkingTwoSupports_IsALocatedError()
    {
        AssertError(Read("links:\n  tie: [ground, plinth]\n"), 11, 17, "ties two supports ('ground' and 'plinth')");
    }

    [Fact]
    public void LinkingAMassToASupport_SaysToDeclareASupport()
    {
        AssertError(Read("links:\n  tie: [deck, ground]\n"), 11, 15, "declare it under 'supports' instead");
    }

    [Fact]
    public void ALinkOfOneMassOrNotAList_IsALocatedError()
    {
        AssertError(Read("links:\n  tie: [deck]\n"), 11, 8, "at least two masses");
        AssertError(Read("links:\n  tie: deck\n"), 11, 8, "must list the masses it ties");
    }

    [Fact]
    public void ASpringInsideALink_IsWarnedAboutAndLeftOut()
    {
        var result = Read("links:\n  tie: [deck, skid]\n");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        Assert.Contains(result.Model!.Warnings, w => w.Position.Line == 9 && w.Message.Contains("spring 'mounts'", StringComparison.Ordinal) && w.Message.Contains("carries no force", StringComparison.Ordinal));
    }
}
