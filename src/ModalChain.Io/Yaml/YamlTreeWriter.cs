using System.Text;
using YamlDotNet.Core;
using YamlDotNet.Core.Events;

namespace ModalChain.Io.Yaml;

/// <summary>Writes a <see cref="YNode"/> tree back to YAML text through YamlDotNet's emitter, so quoting is always valid.</summary>
/// <remarks>
/// Scalars keep their text exactly (quoted ones stay quoted), so units and names read back unchanged. Layout follows
/// the model files' own style: block mappings for the top two levels, flow mappings below, flow lists of scalars.
/// Comments and anchors of the original are not kept.
/// </remarks>
internal static class YamlTreeWriter
{
    public static string Write(YNode root)
    {
        var text = new StringWriter();
        var emitter = new Emitter(text, new EmitterSettings(bestIndent: 2, bestWidth: int.MaxValue, isCanonical: false, maxSimpleKeyLength: 1024));
        emitter.Emit(new StreamStart());
        emitter.Emit(new DocumentStart(null, null, isImplicit: true));
        Emit(emitter, root, depth: 0);
        emitter.Emit(new DocumentEnd(isImplicit: true));
        emitter.Emit(new StreamEnd());
        return text.ToString();
    }

    /// <summary>One node on one line in flow style ("{mass: 12 kg, at: [0, 1]}", a plain or quoted scalar), for inserting into existing text.</summary>
    public static string WriteFlow(YNode node)
    {
        var text = new StringWriter();
        var emitter = new Emitter(text, new EmitterSettings(bestIndent: 2, bestWidth: int.MaxValue, isCanonical: false, maxSimpleKeyLength: 1024));
        emitter.Emit(new StreamStart());
        emitter.Emit(new DocumentStart(null, null, isImplicit: true));
        Emit(emitter, node, depth: 2);
        emitter.Emit(new DocumentEnd(isImplicit: true));
        emitter.Emit(new StreamEnd());
        var line = text.ToString().Replace("\r\n", "\n").Split('\n')[0];
        return line.TrimEnd();
    }

    private static void Emit(IEmitter emitter, YNode node, int depth)
    {
        switch (node)
        {
            case YScalar s:
                emitter.Emit(new Scalar(null, null, s.Value, s.Quoted ? ScalarStyle.DoubleQuoted : ScalarStyle.Any, !s.Quoted, s.Quoted));
                break;
            case YSequence seq:
                var flowList = depth >= 3 || seq.Items.All(i => i is YScalar);
                emitter.Emit(new SequenceStart(null, null, true, flowList ? SequenceStyle.Flow : SequenceStyle.Block));
                foreach (var item in seq.Items) Emit(emitter, item, flowList ? Math.Max(depth + 1, 2) : depth + 1);
                emitter.Emit(new SequenceEnd());
                break;
            case YMapping map:
                emitter.Emit(new MappingStart(null, null, true, depth >= 2 ? MappingStyle.Flow : MappingStyle.Block));
                foreach (var (key, value) in map.Entries)
                {
                    Emit(emitter, key, depth + 1);
                    Emit(emitter, value, depth + 1);
                }
                emitter.Emit(new MappingEnd());
                break;
        }
    }
}
