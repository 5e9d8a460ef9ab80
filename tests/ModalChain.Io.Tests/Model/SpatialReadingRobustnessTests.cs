using System.Text.RegularExpressions;
using ModalChain.Core.Assembly;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Model;

namespace ModalChain.Io.Tests.Model;

/// <summary>Seeded edits of the plane and 3d example models: reading never throws, and what it accepts the assembly accepts.</summary>
public partial class SpatialReadingRobustnessTests
{
    private static readonly string[] Fixtures = ["compressor-skid-deck.yaml", "instrument-cabinet-sway.yaml"];

    private static readonly string[] Numbers = ["0", "-1", "1e308", "-1e-320", "nan", "1e400", "[1, 2]", "{}", "x", "0.1", "3 kN*m/rad", "2 kg*m^2"];

    private static readonly string[] Words = ["x", "y", "z", "rx", "ry", "rz", "w", "ground", "skid", "skid.foot-9", "cabinet.top", "deck", "floor", "3d", "plane", "line"];

    [GeneratedRegex(@"-?\d+(\.\d+)?")]
    private static partial Regex Number();

    [GeneratedRegex(@"\b(x|y|z|rx|ry|rz|ground|deck|floor|wall|skid\.[a-z0-9-]+|cabinet\.[a-z0-9-]+|plane|3d)\b")]
    private static partial Regex Word();

    [Fact]
    public void SeededEdits_NeverThrow_AndEveryAcceptedModelAssembles()
    {
        // 600 cases: one to three edits each (delete, duplicate or swap a line; replace a number or a word).
        var random = new Random(20261202);
        var accepted = 0;
        for (var i = 0; i < 600; i++)
        {
            var name = Fixtures[random.Next(Fixtures.Length)];
            var lines = File.ReadAllLines(Path.Combine(AppContext.BaseDirectory, "models", name)).ToList();
            var edits = 1 + random.Next(3);
            for (var e = 0; e < edits; e++) Edit(lines, random);
            var text = string.Join("\n", lines) + "\n";

            LoadResult result;
            try { result = ModelReader.Read(text, "edited.yaml"); }
            catch (Exception ex) { throw new Xunit.Sdk.XunitException($"case {i} ({name}) threw {ex.GetType().Name}: {ex.Message}\n{text}"); }
            Assert.All(result.Diagnostics, d => Assert.True(d.Position.Line >= 1 && d.Position.Column >= 1, $"case {i}: {d}"));
            if (!result.Succeeded)
            {
                Assert.Contains(result.Diagnostics, d => d.Severity == Severity.Error);
                continue;
            }
            accepted++;
            try { Assembler.Assemble(result.Model!.Network, result.Model.ReferencePoint); }
            catch (ArgumentException ex) { throw new Xunit.Sdk.XunitException($"case {i} ({name}): the reader accepted what the assembly refuses: {ex.Message}\n{text}"); }
        }
        Assert.True(accepted > 40, $"only {accepted} of 600 edited models were accepted: the edits test too little of the accepting path");
    }

    private static void Edit(List<string> lines, Random random)
    {
        var i = random.Next(lines.Count);
        switch (random.Next(5))
        {
            case 0: lines.RemoveAt(i); break;
            case 1: lines.Insert(i, lines[i]); break;
            case 2:
                var j = random.Next(lines.Count);
                (lines[i], lines[j]) = (lines[j], lines[i]);
                break;
            case 3: lines[i] = ReplaceOne(Number(), lines[i], Numbers[random.Next(Numbers.Length)], random); break;
            default: lines[i] = ReplaceOne(Word(), lines[i], Words[random.Next(Words.Length)], random); break;
        }
    }

    private static string ReplaceOne(Regex pattern, string line, string by, Random random)
    {
        var matches = pattern.Matches(line);
        if (matches.Count == 0) return line;
        var m = matches[random.Next(matches.Count)];
        return line[..m.Index] + by + line[(m.Index + m.Length)..];
    }
}
