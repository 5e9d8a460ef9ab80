using ModalChain.Core.Analyses.Studies;
using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Analyses.Studies;

public class ParameterPathTests
{
    private static readonly Network Net = new NetworkBuilder().AddMass("deck", 3200).AddMass("skid.frame", 850)
        .AddSpring("columns", Network.Ground, "deck", 95e6).AddSpring("mounts", "deck", "skid.frame", 8.4e6)
        .AddDamper("loss", "deck", "skid.frame", 1500).Build();

    [Theory]
    [InlineData("springs.columns.stiffness", ParameterKind.Stiffness, "columns", 95e6)]
    [InlineData("masses.skid.frame.mass", ParameterKind.Mass, "skid.frame", 850.0)]
    [InlineData("dampers.loss.coefficient", ParameterKind.DamperCoefficient, "loss", 1500.0)]
    public void ValidPaths_ResolveAndApply(string text, ParameterKind kind, string element, double value)
    {
        var path = ParameterPath.Resolve(text, Net, out var error);
        Assert.Null(error);
        Assert.Equal(new ParameterPath(kind, element), path);
        Assert.Equal(text, path!.Text);
        Assert.Equal(value, path.Get(Net));
        var changed = path.Apply(Net, 2 * value);
        Assert.Equal(2 * value, path.Get(changed));
        Assert.Equal(value, path.Get(Net)); // the original is unchanged
    }

    [Theory]
    [InlineData("springs.roof.stiffness", "no entry 'roof' under 'springs'")]
    [InlineData("masses.deck.at", "not a numeric field")]
    [InlineData("springs.columns.between", "not a numeric field")]
    [InlineData("springs.columns.stifness", "no field 'stifness'")]
    [InlineData("loads.fan.speed", "not a section")]
    [InlineData("springs.columns", "not a parameter path")]
    [InlineData("", "not a parameter path")]
    public void BadPaths_SayWhatIsWrong(string text, string expected)
    {
        Assert.Null(ParameterPath.Resolve(text, Net, out var error));
        Assert.Contains(expected, error);
    }
}
