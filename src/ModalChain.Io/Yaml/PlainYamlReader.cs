using System.Runtime.CompilerServices;
using System.Text;
using ModalChain.Io.Diagnostics;

namespace ModalChain.Io.Yaml;

/// <summary>Reads the plain subset of YAML that large model files are written in straight from UTF-8 bytes into a
/// <see cref="NodeStore"/>, or declines; a declined text is read by YamlDotNet as before.</summary>
/// <remarks>
/// A model written out in full by a script is block mappings of plain names, whose values are plain scalars or
/// one-line flow mappings and lists (<c>g-1-1: {mass: 40 kg, at: [0.5, 0.5]}</c>), with comments and blank lines.
/// For that text YamlDotNet's scanner and parser make about a dozen objects per node before the tree is built; this
/// reader makes none. It accepts only text that is well formed, has no duplicate keys and stays within the nesting
/// limit, so it never has a diagnostic to give, and it gives the tree, positions included, that
/// <see cref="YamlTree.Load(TextReader, Func{string}, string, List{Diagnostic}, bool)"/> gives for the same text
/// (checked against it on every model and corpus file and on generated variants). Anything outside the subset
/// (quotes, anchors and aliases, tags, block scalars, multi-line flow collections or plain scalars, empty values,
/// tabs, documents markers, directives, explicit keys, lone carriage returns, the line breaks YAML 1.1 adds, code
/// points outside the Basic Multilingual Plane) declines the whole text, so every diagnostic still comes from the one
/// reader that gives it today.
/// <para>
/// Columns count UTF-16 code units from 1, as YamlDotNet's marks do.
/// </para>
/// <para>
/// The scanning methods are compiled optimized at their first call (AggressiveOptimization): a command reads its model
/// once, in a fresh process, and would otherwise read much of a large file with unoptimized code.
/// </para>
/// </remarks>
internal sealed class PlainYamlReader
{
    private readonly byte[] _text;
    private readonly int _end;
    private readonly NodeStore _store = new();
    private int _p;            // the byte being read
    private int _line = 1;     // its line, from 1
    private int _lineStart;    // the first byte of that line
    private bool _wideLine;    // the line so far holds bytes of multi-byte characters
    private int _indent;       // spaces before the first character of the content line at _p
    private bool _atEnd;       // no content line is left

    // Short texts are decoded here and looked up in the store's text table, so a repeated one makes no string.
    private readonly char[] _chars = new char[ShortText];
    private readonly KeySet?[] _keys = new KeySet?[YamlTree.MaximumDepth + 1];
    private const int ShortText = 32;

    // YAML 1.2 limits an implicit key to 1024 characters; well below that, so a long key is always left to YamlDotNet.
    private const int LongestKey = 512;

    private PlainYamlReader(byte[] text, int start)
    {
        _text = text;
        _end = text.Length;
        _p = _lineStart = start;
    }

    /// <summary>The text was outside the subset: the caller reads it with YamlDotNet.</summary>
    private sealed class Declined : Exception;

    /// <summary>Reads <paramref name="utf8"/> from byte <paramref name="start"/> (after any byte-order marks); false
    /// when the text is outside the subset.</summary>
    /// <param name="utf8">Valid UTF-8 text.</param>
    /// <param name="start">The first byte of the text.</param>
    /// <param name="root">The top-level mapping when the text was read.</param>
    public static bool TryLoad(byte[] utf8, int start, out YNode? root)
    {
        ArgumentNullException.ThrowIfNull(utf8);
        root = null;
        try
        {
            var reader = new PlainYamlReader(utf8, start);
            if (!reader.NextContentLine() || reader._indent != 0) return false; // empty, or a top level that does not start in column 1
            var slot = reader.BlockMapping(0, depth: 1);
            if (!reader._atEnd) return false;
            root = reader._store.Node(slot);
            return true;
        }
        catch (Declined)
        {
            return false;
        }
    }

    private static Declined Decline() => new();

    private byte At(int i) => i < _end ? _text[i] : (byte)0;

    private bool IsBreak(int i) => i >= _end || _text[i] == (byte)'\n' || (_text[i] == (byte)'\r' && At(i + 1) == (byte)'\n');

    private SourcePosition Position(int i) =>
        new(_line, 1 + (_wideLine ? Encoding.UTF8.GetCharCount(_text, _lineStart, i - _lineStart) : i - _lineStart));

    /// <summary>Moves to the first character of the next line that holds more than spaces and a comment; false at the end.</summary>
    /// <remarks>Called at the start of a line (or at the start of the text).</remarks>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private bool NextContentLine()
    {
        while (true)
        {
            var i = _p;
            while (i < _end && _text[i] == (byte)' ') i++;
            if (i >= _end)
            {
                (_p, _atEnd) = (i, true);
                return false;
            }
            var c = _text[i];
            if (c == (byte)'#')
            {
                _p = SkipComment(i);
                NewLine();
                continue;
            }
            if (c == (byte)'\n' || c == (byte)'\r')
            {
                _p = i;
                NewLine();
                continue;
            }
            if (c == (byte)'\t') throw Decline();
            (_p, _indent) = (i, i - _lineStart);
            return true;
        }
    }

    /// <summary>Steps over the line break at <see cref="_p"/> (or stops at the end of the text).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void NewLine()
    {
        if (_p >= _end)
        {
            _atEnd = true;
            return;
        }
        if (_text[_p] == (byte)'\r')
        {
            if (At(_p + 1) != (byte)'\n') throw Decline(); // a lone carriage return
            _p++;
        }
        if (_text[_p] != (byte)'\n') throw Decline();
        _p++;
        _line++;
        _lineStart = _p;
        _wideLine = false;
    }

    /// <summary>The end of a comment that starts at <paramref name="i"/>: its line break, or the end of the text.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private int SkipComment(int i)
    {
        while (i < _end)
        {
            var c = _text[i];
            if (c == (byte)'\n') return i;
            if (c == (byte)'\r') return At(i + 1) == (byte)'\n' ? i : throw Decline();
            if (c < 0x20 || c == 0x7F) throw Decline(); // tabs and control characters: left to YamlDotNet
            i = c < 0x80 ? i + 1 : Wide(i);
        }
        return i;
    }

    /// <summary>Checks the multi-byte character at <paramref name="i"/> and returns the index after it.</summary>
    /// <remarks>Declines what YAML 1.1 reads as a line break (U+0085, U+2028, U+2029), the byte-order mark, C1 controls,
    /// non-characters and anything outside the Basic Multilingual Plane (two UTF-16 units, one column or two?).</remarks>
    private int Wide(int i)
    {
        var c = _text[i];
        int length, point;
        if (c >= 0xF0 || c < 0xC0) throw Decline();
        if (c < 0xE0)
        {
            length = 2;
            point = ((c & 0x1F) << 6) | (At(i + 1) & 0x3F);
        }
        else
        {
            length = 3;
            point = ((c & 0x0F) << 12) | ((At(i + 1) & 0x3F) << 6) | (At(i + 2) & 0x3F);
        }
        if (point < 0xA0 || point is 0x2028 or 0x2029 or 0xFEFF or 0xFFFE or 0xFFFF) throw Decline();
        _wideLine = true;
        return i + length;
    }

    /// <summary>After a value: spaces, an optional comment after a space, and the line break; then the next content line.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void EndOfEntry()
    {
        var i = _p;
        while (i < _end && _text[i] == (byte)' ') i++;
        if (i < _end && _text[i] == (byte)'#')
        {
            if (i == _p) throw Decline(); // '#' straight after a value does not start a comment
            i = SkipComment(i);
        }
        if (!IsBreak(i)) throw Decline();
        _p = i;
        NewLine();
        if (!_atEnd) NextContentLine();
    }

    private static bool IsFlowIndicator(byte c) => c is (byte)',' or (byte)'[' or (byte)']' or (byte)'{' or (byte)'}';

    /// <summary>Reads a plain scalar at <see cref="_p"/> into the store; <see cref="_p"/> ends after its last non-space character.</summary>
    /// <param name="flow">Inside a flow collection, where ',', ']' and '}' end the scalar.</param>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private (int Slot, string Text) PlainScalar(bool flow)
    {
        var start = _p;
        var c = At(start);
        var next = At(start + 1);
        // The characters that may not start a plain scalar, or only before certain others; kept stricter than YAML.
        switch (c)
        {
            case (byte)'-' when next is (>= (byte)'0' and <= (byte)'9') or (>= (byte)'a' and <= (byte)'z') or (>= (byte)'A' and <= (byte)'Z') or (byte)'.':
            case (byte)'.' when next is >= (byte)'0' and <= (byte)'9':
                break;
            case (byte)'-' or (byte)'.' or (byte)'?' or (byte)':' or (byte)',' or (byte)'[' or (byte)']' or (byte)'{' or (byte)'}'
                or (byte)'#' or (byte)'&' or (byte)'*' or (byte)'!' or (byte)'|' or (byte)'>' or (byte)'\'' or (byte)'"'
                or (byte)'%' or (byte)'@' or (byte)'`' or (byte)' ':
                throw Decline();
        }
        var i = start;
        var last = start; // one past the last non-space character
        while (true)
        {
            if (i >= _end) break;
            c = _text[i];
            if (c == (byte)' ')
            {
                var j = i;
                while (j < _end && _text[j] == (byte)' ') j++;
                if (IsBreak(j) || _text[j] == (byte)'#' || (flow && _text[j] is (byte)',' or (byte)']' or (byte)'}')) break;
                if (_text[j] == (byte)':') throw Decline(); // "key  : value": left to YamlDotNet
                i = j;
                continue;
            }
            if (c == (byte)'\n' || c == (byte)'\r') break; // a lone '\r' is declined by the line's end
            if (c == (byte)':')
            {
                if (IsBreak(i + 1) || _text[i + 1] == (byte)' ') break;
                throw Decline(); // ':' inside a scalar
            }
            if (flow && c is (byte)',' or (byte)']' or (byte)'}') break;
            if (IsFlowIndicator(c) && c != (byte)',') throw Decline(); // brackets inside a scalar
            if (c == (byte)'#' || c == (byte)'\t' || c < 0x20 || c == 0x7F) throw Decline();
            i = c < 0x80 ? i + 1 : Wide(i);
            last = i;
        }
        if (last == start) throw Decline();
        _p = last;
        var (id, text) = Text(start, last);
        return (_store.AddScalar(Position(start), id, quoted: false), text);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private (int Id, string Text) Text(int start, int end)
    {
        var length = end - start;
        if (length > ShortText) return _store.Intern(Encoding.UTF8.GetString(_text, start, length));
        var count = Encoding.UTF8.GetChars(_text, start, length, _chars, 0);
        return _store.Intern(_chars.AsSpan(0, count));
    }

    /// <summary>A key at <see cref="_p"/>, followed by ':' and a space or the line's end; <see cref="_p"/> ends after the ':'.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private string Key(bool flow)
    {
        var start = _p;
        var (_, text) = PlainScalar(flow);
        if (At(_p) != (byte)':' || _p - start > LongestKey) throw Decline();
        _p++;
        return text;
    }

    /// <summary>Rejects (declines) a key seen before in the same mapping.</summary>
    /// <remarks>One per depth, reused by every mapping opened at that depth (a large model has hundreds of thousands).</remarks>
    private sealed class KeySet
    {
        private readonly List<string> _few = [];
        private HashSet<string>? _many;

        public KeySet Reset()
        {
            _few.Clear();
            _many = null;
            return this;
        }

        [MethodImpl(MethodImplOptions.AggressiveOptimization)]
        public void Add(string key)
        {
            if (_many is null && _few.Count < 16)
            {
                foreach (var k in _few)
                    if (k == key) throw Decline();
                _few.Add(key);
                return;
            }
            _many ??= new HashSet<string>(_few, StringComparer.Ordinal);
            if (!_many.Add(key)) throw Decline();
        }
    }

    private void SkipSpaces()
    {
        while (_p < _end && _text[_p] == (byte)' ') _p++;
    }

    /// <summary>A value on the line of its key or list marker: a flow collection or a plain scalar.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private int InlineValue(int depth, bool flow)
    {
        var c = At(_p);
        if (c == (byte)'{') return FlowMapping(depth);
        if (c == (byte)'[') return FlowSequence(depth);
        return PlainScalar(flow).Slot;
    }

    /// <summary>A block mapping whose keys start in column <paramref name="indent"/> + 1, from the first key at <see cref="_p"/>.</summary>
    /// <param name="indent">Spaces before each key.</param>
    /// <param name="depth">Collections open, this one included.</param>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private int BlockMapping(int indent, int depth)
    {
        if (depth > YamlTree.MaximumDepth) throw Decline();
        var slot = _store.OpenCollection(Position(_p), NodeStore.Kind.Mapping);
        var keys = (_keys[depth] ??= new KeySet()).Reset();
        var count = 0;
        while (true)
        {
            if (At(_p) == (byte)'-' && (IsBreak(_p + 1) || At(_p + 1) == (byte)' ')) throw Decline(); // a list where a key belongs
            keys.Add(Key(flow: false));
            count++;
            var afterColon = _p;
            SkipSpaces();
            if (IsBreak(_p) || At(_p) == (byte)'#')
            {
                // The value is on the lines below, indented deeper: a mapping or a list.
                if (At(_p) == (byte)'#' && _p == afterColon) throw Decline();
                EndOfEntry();
                if (_atEnd || _indent <= indent) throw Decline(); // an empty value
                if (At(_p) == (byte)'-' && (IsBreak(_p + 1) || At(_p + 1) == (byte)' ')) BlockSequence(_indent, depth + 1);
                else BlockMapping(_indent, depth + 1);
            }
            else
            {
                InlineValue(depth + 1, flow: false);
                EndOfEntry();
            }
            if (_atEnd || _indent < indent) break;
            if (_indent > indent) throw Decline();
        }
        _store.CloseCollection(slot, count, dropped: false);
        return slot;
    }

    /// <summary>A block list whose '-' markers are in column <paramref name="indent"/> + 1; every item on its marker's line.</summary>
    private int BlockSequence(int indent, int depth)
    {
        if (depth > YamlTree.MaximumDepth) throw Decline();
        var slot = _store.OpenCollection(Position(_p), NodeStore.Kind.Sequence);
        var count = 0;
        while (true)
        {
            if (At(_p) != (byte)'-' || At(_p + 1) != (byte)' ') throw Decline();
            _p += 2;
            SkipSpaces();
            if (IsBreak(_p) || At(_p) == (byte)'#') throw Decline(); // the item on the lines below
            InlineValue(depth + 1, flow: false);
            if (At(_p) == (byte)':') throw Decline(); // "- key: value", a mapping in the list
            count++;
            EndOfEntry();
            if (_atEnd || _indent < indent) break;
            if (_indent > indent) throw Decline();
        }
        _store.CloseCollection(slot, count, dropped: false);
        return slot;
    }

    /// <summary>Spaces inside a flow collection, which must close on its own line.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void FlowSpaces()
    {
        SkipSpaces();
        if (IsBreak(_p) || At(_p) is (byte)'#' or (byte)'\t') throw Decline();
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private int FlowMapping(int depth)
    {
        if (depth > YamlTree.MaximumDepth) throw Decline();
        var slot = _store.OpenCollection(Position(_p), NodeStore.Kind.Mapping);
        _p++;
        FlowSpaces();
        var keys = (_keys[depth] ??= new KeySet()).Reset();
        var count = 0;
        if (At(_p) != (byte)'}')
        {
            while (true)
            {
                keys.Add(Key(flow: true));
                count++;
                if (At(_p) != (byte)' ') throw Decline();
                FlowSpaces();
                if (At(_p) is (byte)',' or (byte)'}') throw Decline(); // an empty value
                InlineValue(depth + 1, flow: true);
                FlowSpaces();
                if (At(_p) == (byte)'}') break;
                if (At(_p) != (byte)',') throw Decline();
                _p++;
                FlowSpaces();
                if (At(_p) == (byte)'}') throw Decline(); // a trailing comma
            }
        }
        _p++;
        _store.CloseCollection(slot, count, dropped: false);
        return slot;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private int FlowSequence(int depth)
    {
        if (depth > YamlTree.MaximumDepth) throw Decline();
        var slot = _store.OpenCollection(Position(_p), NodeStore.Kind.Sequence);
        _p++;
        FlowSpaces();
        var count = 0;
        if (At(_p) != (byte)']')
        {
            while (true)
            {
                InlineValue(depth + 1, flow: true);
                if (At(_p) == (byte)':') throw Decline(); // "[key: value]", a mapping in the list
                count++;
                FlowSpaces();
                if (At(_p) == (byte)']') break;
                if (At(_p) != (byte)',') throw Decline();
                _p++;
                FlowSpaces();
                if (At(_p) == (byte)']') throw Decline(); // a trailing comma
            }
        }
        _p++;
        _store.CloseCollection(slot, count, dropped: false);
        return slot;
    }
}
