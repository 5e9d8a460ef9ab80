using ModalChain.Io.Model;
using static ModalChain.Io.Tests.Model.ModelText;

namespace ModalChain.Io.Tests.Model;

/// <summary>
/// The masses, springs, dampers and inerters sections read valid entries straight from the tree's slots and leave
/// everything else to the general reader. The two must agree [identity: the same model with every name and value
/// quoted, which the slot readers leave to the general reader], and an entry the general reader rejects must be
/// rejected with its message even when its value text was already read (and remembered) for an earlier entry.
/// </summary>
public class ValidEntryReadingTests
{
    private static readonly string[] Forms =
    [
        "title: forms",
        "masses:",
        "  a: 40 kg",
        "  b: {mass: 40 kg, at: [0.5, 1]}",
        "  c: {at: [1 m, 2000 mm], mass: 2.5 t}",
        "  d: {mass: 12}",
        "  e: &heavy {mass: 3 t, at: [-2, 0]}",
        "  f: 7 lb",
        "  g: *heavy",
        "supports:",
        "  wall: {at: [5, 5]}",
        "springs:",
        "  k1: {between: [ground, a], stiffness: 5 MN/m}",
        "  k2: {stiffness: 5 MN/m, between: [a, b]}",
        "  k3: {between: [b, wall], stiffness: 40 N/mm}",
        "  k4: {between: [c, d], stiffness: 3e5}",
        "  k5: {between: [d, e], stiffness: 5 MN/m}",
        "  k6: {between: [e, f], stiffness: 1 kN/mm}",
        "  k7: {between: [f, ground], stiffness: 0}",
        "  k8: {between: [c, b], stiffness: 5 MN/m}",
        "  k9: {between: [g, a], stiffness: 5 MN/m}",
        "dampers:",
        "  c1: {between: [ground, a], coefficient: 10 N*s/m}",
        "  c2: {between: [b, c], coefficient: 10 N*s/m}",
        "inerters:",
        "  i1: {between: [d, e], inertance: 40 kg}",
    ];

    [Fact]
    public void EveryFormOfValidEntry_ReadsAsTheGeneralReaderReadsIt()
    {
        var direct = Read(Forms);
        var general = Read([.. Forms.Select(QuoteNamesAndValues)]);
        Assert.True(direct.Succeeded, string.Join("\n", direct.Diagnostics));
        Assert.True(general.Succeeded, string.Join("\n", general.Diagnostics));
        var (x, y) = (direct.Model!.Network, general.Model!.Network);
        Assert.Equal(y.Masses.Select(m => (m.Name, m.Kilograms, m.Position)), x.Masses.Select(m => (m.Name, m.Kilograms, m.Position)));
        Assert.Equal(y.Supports.Select(t => (t.Name, t.Position)), x.Supports.Select(t => (t.Name, t.Position)));
        Assert.Equal(y.Springs.Select(Describe), x.Springs.Select(Describe));
        Assert.Equal(y.Dampers.Select(d => (d.Name, d.NodeA, d.NodeB, d.Coefficient)), x.Dampers.Select(d => (d.Name, d.NodeA, d.NodeB, d.Coefficient)));
        Assert.Equal(y.Inerters.Select(i => (i.Name, i.NodeA, i.NodeB, i.Inertance)), x.Inerters.Select(i => (i.Name, i.NodeA, i.NodeB, i.Inertance)));
        Assert.Equal(7, x.Masses.Length);
        Assert.Equal(9, x.Springs.Length);
        Assert.Equal(general.Diagnostics.Select(d => d.ToString()), direct.Diagnostics.Select(d => d.ToString()));
        foreach (var key in new[] { "masses.a", "masses.e", "masses.f", "masses.g", "springs.k1", "springs.k8", "dampers.c2", "inerters.i1" })
            Assert.Equal(general.Model.Positions[key], direct.Model.Positions[key]);
        Assert.Equal(general.Model.Positions.Count, direct.Model.Positions.Count);
        Assert.Equal(general.Model.WrittenUnits, direct.Model.WrittenUnits);
    }

    [Fact]
    public void AnEntryTheGeneralReaderRejects_IsRejected_ThoughItsValueTextsWereReadBefore()
    {
        string[] lines =
        [
            "masses:",
            "  a: {mass: 40 kg, at: [0.5, 1]}",
            "  b: {mass: 2e9 kg, at: [0.5, 1]}",
            "  c: {mass: 2e9 kg, at: [0.5, 1]}",              // line 4: the text of the error above, now remembered
            "  d: {mass: 40 kg, at: [0.5, 1], directions: [z]}",
            "  e: {mass: 40 kg, at: [0.5, 2e5]}",
            "  f: {mass: 40 kg, at: [0.5, 2e5]}",             // line 7
            "  g: {mass: 40 kg, colour: red}",
            "  h: {at: [0.5, 1]}",
            "  j: {mass: 40 kg, at: [0.5, 1, 2]}",
            "  k: 40 kg",
            "springs:",
            "  s1: {between: [ground, a], stiffness: 5 MN/m}",
            "  s2: {between: [a, a], stiffness: 5 MN/m}",
            "  s3: {between: [a, nowhere], stiffness: 5 MN/m}",
            "  s4: {between: [a, k], stiffness: 5 MN/m, axial: 5 MN/m}",
            "  s5: {between: [a], stiffness: 5 MN/m}",
            "  s6: {between: [a, k]}",
            "  s7: {between: [a, k], stiffness: -5 MN/m}",
            "  s8: {between: [a, k], stiffness: -5 MN/m}",    // line 20
            "  s9: {between: [a, k], stiffness: {x: 5 MN/m}}",
            "  ground: {between: [a, k], stiffness: 5 MN/m}",
            "  s10: {between: [a, ~], stiffness: 5 MN/m}",
        ];
        var r = Read(lines);
        void At(int line, string token, string fragment) => ErrorAt(r, line, ColumnOf(lines[line - 1], token), fragment);
        At(3, "2e9", "'mass' of mass 'b'");
        At(4, "2e9", "'mass' of mass 'c'");
        At(5, "directions", "'directions' of mass 'd'");
        At(6, "2e5", "'at' of mass 'e'");
        At(7, "2e5", "'at' of mass 'f'");
        At(8, "colour", "unknown key 'colour'");
        At(9, "h", "mass 'h' needs 'mass'");
        At(10, "[", "'at' of mass 'j'");
        At(14, "[", "spring 's2' connects 'a' to itself");
        At(15, "nowhere", "unknown node 'nowhere'");
        At(16, "axial", "'axial' of spring 's4'");
        At(17, "[", "'between' of spring 's5'");
        At(18, "s6", "spring 's6' needs 'stiffness'");
        At(19, "-5", "'stiffness' of spring 's7'");
        At(20, "-5", "'stiffness' of spring 's8'");
        At(21, "{x", "'stiffness' of spring 's9' is given per direction");
        At(22, "ground", "'ground' is the reserved fixed support");
        At(23, "~", "'between' of spring 's10' must be text");
        Assert.Equal(18, r.Errors.Count());
    }

    private static (string, string, string, double) Describe(Core.Model.Spring s) => (s.Name, s.NodeA, s.NodeB, s.Stiffness);

    /// <summary>The line with every plain name and value of an element entry double-quoted (keys of the entry, such as
    /// 'mass' and 'between', are left plain); the title and section lines are kept.</summary>
    private static string QuoteNamesAndValues(string line)
    {
        if (!line.StartsWith("  ", StringComparison.Ordinal)) return line;
        var colon = line.IndexOf(':', StringComparison.Ordinal);
        var name = line[2..colon];
        // A scalar after ": ", "[" or ", " that runs to ',', ']', '}' or the line's end is a value (a key runs to ':').
        var quoted = System.Text.RegularExpressions.Regex.Replace(line[colon..], @"(?<=: |\[|, )[^\[\]{},:&*]+(?=[,\]}]|$)", m => $"\"{m.Value}\"");
        return $"  \"{name}\"{quoted}";
    }
}
