using System.Text;
using ModalChain.Io.Model;

namespace ModalChain.Io.Tests.Model;

/// <summary>The element-name check gives the answer of its regular expression for every name
/// [reference library: .NET's regular expressions, the pattern the check states; identity on random names].</summary>
public class NameCheckTests
{
    [Theory]
    [InlineData("deck", true)]
    [InlineData("g-1-1", true)]
    [InlineData("_x.y", true)]
    [InlineData("9a", true)]
    [InlineData("a\n", true)]     // '$' matches before a final line break
    [InlineData("a\n\n", false)]
    [InlineData("\n", false)]
    [InlineData("", false)]
    [InlineData("-a", false)]
    [InlineData(".a", false)]
    [InlineData("a b", false)]
    [InlineData("a:b", false)]
    [InlineData("Träger-1", true)]
    [InlineData("µ-damper", true)]
    [InlineData("a\u00A0b", false)]
    public void KnownNames_AreJudgedAsThePatternJudgesThem(string name, bool usable)
    {
        Assert.Equal(usable, ModelReader.NamePattern().IsMatch(name));
        Assert.Equal(usable, ModelReader.IsUsableName(name));
    }

    [Fact]
    public void RandomNames_AreJudgedAsThePatternJudgesThem()
    {
        const string alphabet = "aZ09_.-\n \t:#é中µ²Ⅻ\u00A0\u0300\uD83D\uDE00";
        var random = new Random(11);
        var (usable, tried) = (0, 0);
        for (var round = 0; round < 20_000; round++)
        {
            var name = new StringBuilder();
            for (var length = random.Next(6); length > 0; length--) name.Append(alphabet[random.Next(alphabet.Length)]);
            var text = name.ToString();
            var expected = ModelReader.NamePattern().IsMatch(text);
            Assert.True(expected == ModelReader.IsUsableName(text), $"'{text}'");
            tried++;
            if (expected) usable++;
        }
        Assert.True(usable > tried / 20, $"only {usable} of {tried} random names usable: the test checks too few of them");
    }
}
