using System.Diagnostics;
using ModalChain.Io.Files;
using ModalChain.Io.Model;

namespace ModalChain.Io.Tests.Files;

/// <summary>
/// Only regular files of bounded size are read, as model files or time tables (issue 12, item 5): a FIFO used to
/// block the reader for ever, /dev/zero ran it out of memory. Each refusal is one error naming the file.
/// </summary>
public sealed class InputFileTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("modalchain-input-").FullName;

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Fact]
    public void NamedPipe_AsTheModel_IsRefusedWithoutOpeningIt()
    {
        var fifo = MakeFifo("model.yaml");
        var result = ReadWithinAMinute(() => ModelReader.ReadFile(fifo));
        var error = Assert.Single(result.Errors);
        Assert.Contains("is a named pipe (FIFO), not a regular file", error.Message, StringComparison.Ordinal);
        Assert.StartsWith($"{fifo}:1:1: error: ", error.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void NamedPipe_AsATimeTable_IsRefusedAtTheFileEntry()
    {
        MakeFifo("hammer.csv");
        const string line3 = "  hit: {kind: force, at: deck, time: {kind: table, file: hammer.csv}}";
        var model = Path.Combine(_folder, "model.yaml");
        File.WriteAllText(model, $"masses: {{deck: 3200 kg}}\nloads:\n{line3}\nsprings: {{s: {{between: [ground, deck], stiffness: 95 kN/mm}}}}\n");
        var result = ReadWithinAMinute(() => ModelReader.ReadFile(model));
        var error = Assert.Single(result.Errors);
        Assert.Equal(new Diagnostics.SourcePosition(3, line3.IndexOf("hammer.csv", StringComparison.Ordinal) + 1), error.Position);
        Assert.Contains("is a named pipe (FIFO), not a regular file; a time table must be a regular file", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("/dev/zero")]
    [InlineData("/dev/urandom")]
    [InlineData("/dev/null")]
    public void CharacterDevice_IsRefused(string device)
    {
        var error = Assert.Single(ModelReader.ReadFile(device).Errors);
        Assert.Contains($"'{device}' is a character device, not a regular file", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Directory_IsRefused()
    {
        var error = Assert.Single(ModelReader.ReadFile(_folder).Errors);
        Assert.Contains("is a directory; name the model file itself", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void MissingFile_IsReportedAsNotFound()
    {
        var error = Assert.Single(ModelReader.ReadFile(Path.Combine(_folder, "nothing.yaml")).Errors);
        Assert.Equal("file not found", error.Message);
    }

    [Fact]
    public void OversizeModel_IsRefusedFromItsSize_BeforeAnyByteIsRead()
    {
        // A sparse file: 64 MiB and one byte long, no disk blocks written.
        var path = Path.Combine(_folder, "huge.yaml");
        using (var stream = new FileStream(path, FileMode.CreateNew)) stream.SetLength(InputFile.MaximumModelBytes + 1);
        var error = Assert.Single(ModelReader.ReadFile(path).Errors);
        Assert.Contains("the file is 67,108,865 bytes; a model file may be at most 64 MiB", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void FileOfExactlyTheLimit_IsRead_AndOneByteMoreIsNot()
    {
        var path = Path.Combine(_folder, "table.csv");
        File.WriteAllBytes(path, new byte[100]);
        Assert.Equal(100, InputFile.ReadAllBytes(path, limit: 100, "time table", out var none)!.Length);
        Assert.Null(none);
        Assert.Null(InputFile.ReadAllBytes(path, limit: 99, "time table", out var error));
        Assert.Equal("the file is 100 bytes; a time table may be at most 99 bytes (see docs/model-format.md)", error);
    }

    [Fact]
    public void EndlessStream_IsCutOffOneByteBeyondTheLimit()
    {
        // What a device that never ends costs when the kind of file cannot be asked first (outside Linux).
        var endless = new EndlessStream();
        Assert.Null(InputFile.ReadAtMost(endless, limit: 1_000_000, "model file", out var error));
        Assert.Equal("the file holds more than 1,000,000 bytes; a model file may be at most 1,000,000 bytes (see docs/model-format.md)", error);
        Assert.Equal(1_000_001, endless.Delivered);
    }

    private string MakeFifo(string name)
    {
        var path = Path.Combine(_folder, name);
        using var mkfifo = Process.Start(new ProcessStartInfo("mkfifo", [path]) { UseShellExecute = false })!;
        mkfifo.WaitForExit();
        Assert.Equal(0, mkfifo.ExitCode);
        return path;
    }

    // A guard against the old behaviour (blocking for ever), not a timing check: the read takes milliseconds.
    private static LoadResult ReadWithinAMinute(Func<LoadResult> read)
    {
        var task = Task.Run(read);
        Assert.True(task.Wait(TimeSpan.FromMinutes(1)), "reading blocked on the named pipe");
        return task.Result;
    }

    private sealed class EndlessStream : Stream
    {
        public long Delivered { get; private set; }
        public override bool CanRead => true;
        public override bool CanSeek => false;
        public override bool CanWrite => false;
        public override long Length => throw new NotSupportedException();
        public override long Position { get => Delivered; set => throw new NotSupportedException(); }
        public override void Flush() { }
        public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();
        public override void SetLength(long value) => throw new NotSupportedException();
        public override void Write(byte[] buffer, int offset, int count) => throw new NotSupportedException();

        public override int Read(byte[] buffer, int offset, int count)
        {
            Array.Clear(buffer, offset, count);
            Delivered += count;
            return count;
        }
    }
}
