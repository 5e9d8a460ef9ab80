using System.Collections.Immutable;
using System.Security.Cryptography;
using System.Text;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Files;
using ModalChain.Io.Yaml;

namespace ModalChain.Io.Model;

/// <summary>Reads a model file (YAML) into a checked <see cref="ModelDocument"/>, collecting every problem at once.</summary>
/// <remarks>
/// The format is described in docs/model-format.md. Each top-level section has its own reader in a file
/// <c>ModelReader.Section.cs</c>; values are converted to SI here and nowhere else.
/// </remarks>
public static partial class ModelReader
{
    /// <summary>Top-level keys and what they hold, in the order docs/model-format.md lists them.</summary>
    private static readonly string[] TopLevelKeys = ["title", "masses", "supports", "springs", "dampers", "inerters", "links", "damping", "loads", "load-cases", "harmonic", "transient", "criteria", "repeat", "space", "bodies", "reference-point", "nodes", "mounts", "transducers", "circuit"];

    /// <summary>Reads the file at <paramref name="path"/>; a missing or unreadable file is an error diagnostic, not an exception.</summary>
    public static LoadResult ReadFile(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (InputFile.ReadAllBytes(path, InputFile.MaximumModelBytes, "model file", out var error) is not { } bytes)
            return new LoadResult(null, [new Diagnostic(Severity.Error, path, new SourcePosition(1, 1), error!)]);
        return Read(bytes, path);
    }

    /// <summary>Reads model text; <paramref name="file"/> names it in diagnostics.</summary>
    public static LoadResult Read(string text, string file) => Read(Encoding.UTF8.GetBytes(text), file);

    private static LoadResult Read(byte[] bytes, string file)
    {
        var context = new ReadContext(file);
        YNode? root;
        if (bytes is [0xFF, 0xFE, ..] or [0xFE, 0xFF, ..] || !System.Text.Unicode.Utf8.IsValid(bytes))
        {
            if (Decode(bytes, context) is not { } text) return Finish(context, null);
            root = YamlTree.Load(text, file, context.Diagnostics);
        }
        else if (PlainYamlReader.TryLoad(bytes, Utf8Start(bytes), out var plain))
        {
            // The plain subset large models are written in, read without YamlDotNet (the same tree; see PlainYamlReader).
            root = plain;
        }
        else
        {
            // Valid UTF-8 (the usual case) is decoded as the parser reads it, not held a second time as one string.
            var bom = Utf8Start(bytes);
            using var reader = new StreamReader(new MemoryStream(bytes, bom, bytes.Length - bom, writable: false), StrictUtf8, detectEncodingFromByteOrderMarks: false);
            root = YamlTree.Load(reader, () => Decode(bytes, context) ?? "", file, context.Diagnostics,
                readAhead: bytes.Length >= ReadAheadBytes && Environment.ProcessorCount > 1);
        }
        if (root is null || (root is YScalar s && s.IsPlainNull))
        {
            if (!context.HasErrors) context.Error(new SourcePosition(1, 1), "the model file is empty; it needs at least a 'masses' section");
            return Finish(context, null);
        }
        if (context.Mapping(root, "the model file") is not { } top) return Finish(context, null);

        context.RejectUnknownKeys(top, "the model file", TopLevelKeys);
        // A circuit model has a reader of its own (ModelReader.Circuit.cs): no masses, supports or loads. A model with
        // masses and a circuit is a line model with the circuit inside (ModelReader.MixedCircuit.cs).
        if (top["circuit"] is not null && !HasMechanicalNetwork(top)) return ReadCircuitModel(top, context, file, bytes);
        // The space decides how masses, supports, springs and loads read: after a wrong one nothing else can be read sensibly.
        if (ReadSpace(top, context) is not { } space) return Finish(context, null);
        var spatial = space == Core.Model.ModelSpace.Line ? null : new SpatialNodes(space);
        CheckSectionsForSpace(top, space, context);
        RefuseTransducersOutsideLine(top, space, context);
        if (space != Core.Model.ModelSpace.Line) RefuseCircuitOutsideLine(top, context);
        var embedding = space == Core.Model.ModelSpace.Line && top["circuit"] is not null ? new CircuitEmbedding() : null;
        var referencePoint = ReadReferencePoint(top, space, context);
        var repeated = spatial is null ? ReadRepeat(top, context) : new Repeated();
        var network = ReadNetwork(top, context, Path.GetFileNameWithoutExtension(file), repeated, spatial, embedding);
        var massNames = DeclaredNames(top, "masses");
        massNames.UnionWith(repeated.MassNames);
        var supportNames = DeclaredNames(top, "supports");
        var damping = ReadDamping(top, context);
        if (embedding is not null) RefuseDistributedDampingWithCircuit(top, damping, context);
        var loads = ReadLoads(top, massNames, supportNames, context, spatial);
        // A circuit's sources are loads named after them (Core/Analyses/Circuits/CircuitSources).
        loads = loads.AddRange(EmbeddedSourceLoads(embedding, context));
        var sources = EmbeddedSourceNames(embedding);
        var loadCases = ReadLoadCases(top, loads, context);
        // Plane and 3d models: outputs may name masses, bodies and DOF labels (skid.z, skid.ry); initial conditions a
        // translation DOF label (a mass that moves in one direction by its bare name).
        IReadOnlySet<string> outputNames = massNames, initialNames = massNames;
        // Line models: outputs may also name massless nodes and the inner nodes of mounts (their motion is reported).
        if (spatial is null && (top["nodes"] is not null || top["mounts"] is not null))
        {
            var withNodes = new HashSet<string>(massNames, StringComparer.Ordinal);
            if (top["nodes"] is YSequence nodeList)
                foreach (var item in nodeList.Items) if (item is YScalar { IsPlainNull: false } listed) withNodes.Add(listed.Value);
            withNodes.UnionWith(DeclaredNames(top, "nodes"));
            withNodes.UnionWith(DeclaredNames(top, "mounts").Select(Core.Model.MountExpansion.InnerNode));
            outputNames = withNodes;
        }
        // A circuit's free nodes are outputs too: their velocity is the node voltage.
        if (embedding?.Analogy is not null) outputNames = new HashSet<string>(outputNames.Concat(embedding.FreeNodes), StringComparer.Ordinal);
        if (spatial is not null && network is not null)
        {
            var dofs = Core.Dofs.DofMap.For(network);
            var labels = Enumerable.Range(0, dofs.Count).Select(dofs.Label);
            outputNames = new HashSet<string>(massNames.Concat(network.Bodies.Select(b => b.Name)).Concat(labels), StringComparer.Ordinal);
            // A massless node's motion is no state of its own (it follows from the others): no initial condition.
            var massless = network.Masses.Where(m => m.Kilograms == 0).Select(m => m.Name).ToHashSet(StringComparer.Ordinal);
            initialNames = new HashSet<string>(Enumerable.Range(0, dofs.Count)
                .Where(i => !Core.Model.Directions.IsRotation(dofs.Dofs[i].Direction) && !massless.Contains(dofs.Dofs[i].Node)).Select(dofs.Label), StringComparer.Ordinal);
        }
        var harmonic = ReadHarmonic(top, outputNames, loads, context, sources);
        var caseSelection = ReadCaseSelection(top, loadCases, context);
        var timedLoads = ReadTimedLoads(top, massNames, supportNames, context, spatial).AddRange(EmbeddedSourceHistories(embedding));
        var transient = ReadTransient(top, outputNames, timedLoads, context, initialNames, spatial is not null, sources);
        var criteria = ReadCriteria(top, context, network);
        if (network is not null) CheckTransducerReferences(top, network, loads, timedLoads, context);
        if (network is null || context.HasErrors) return Finish(context, null);

        var document = new ModelDocument(
            file,
            Convert.ToHexStringLower(SHA256.HashData(bytes)),
            network,
            [.. context.Diagnostics.Where(d => d.Severity == Severity.Warning)],
            // A read-only view of the reader's own table, which nothing changes after reading: no copy of its
            // 300,000 entries on a large model (about 20 MiB less at the peak of a 100,000-mass read).
            new System.Collections.ObjectModel.ReadOnlyDictionary<string, SourcePosition>(context.Positions))
        {
            Structure = new Core.Model.StructuralModel(network, damping, loads),
            Harmonic = harmonic,
            LoadCases = loadCases,
            Cases = caseSelection,
            TimedLoads = timedLoads,
            Transient = transient,
            Criteria = criteria,
            ReferencePoint = referencePoint,
            WrittenUnits = context.WrittenUnits(),
            EmbeddedCircuit = embedding?.Circuit,
        };
        return Finish(context, document);
    }

    // Model files are UTF-8 (with or without a byte-order mark). A file saved as UTF-16 ("Unicode" in some Windows
    // editors) is decoded by its mark; any other encoding is reported rather than silently turned into U+FFFD.
    private static string? Decode(byte[] bytes, ReadContext context)
    {
        if (bytes is [0xFF, 0xFE, ..]) return Encoding.Unicode.GetString(bytes, 2, bytes.Length - 2);
        if (bytes is [0xFE, 0xFF, ..]) return Encoding.BigEndianUnicode.GetString(bytes, 2, bytes.Length - 2);
        try { return StrictUtf8.GetString(bytes).TrimStart('\uFEFF'); }
        catch (DecoderFallbackException) { } // found again below, with its line and column
        var chars = new char[bytes.Length];
        var status = System.Text.Unicode.Utf8.ToUtf16(bytes, chars, out var read, out var written, replaceInvalidSequences: false);
        if (status == System.Buffers.OperationStatus.Done) return new string(chars, 0, written).TrimStart('\uFEFF');

        var decoded = new string(chars, 0, written).TrimStart('\uFEFF');
        var line = decoded.Count(c => c == '\n') + 1;
        var column = decoded.Length - (decoded.LastIndexOf('\n') + 1) + 1;
        context.Error(new SourcePosition(line, column),
            $"the file is not UTF-8 text (byte 0x{bytes[read]:X2} here); save it with UTF-8 encoding");
        return null;
    }

    // The first byte after any UTF-8 byte-order marks, as TrimStart('\uFEFF') on the decoded text.
    private static int Utf8Start(byte[] bytes)
    {
        var bom = 0;
        while (bytes.AsSpan(bom) is [0xEF, 0xBB, 0xBF, ..]) bom += 3;
        return bom;
    }

    // Above this size the YAML parser runs on a thread of its own, ahead of the tree (a 100,000-mass model is 16 MiB).
    private const int ReadAheadBytes = 1 << 20;

    private static readonly UTF8Encoding StrictUtf8 = new(encoderShouldEmitUTF8Identifier: false, throwOnInvalidBytes: true);

    private static LoadResult Finish(ReadContext context, ModelDocument? model) =>
        new(model, [.. context.Diagnostics.OrderBy(d => d.Position.Line).ThenBy(d => d.Position.Column)]);
}
