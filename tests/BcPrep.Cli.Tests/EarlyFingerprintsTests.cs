using System.Diagnostics;
using BcPrep.Cli;
using BcPrep.Reading;
using BcPrep.Tests.Cli.Support;
using BcPrep.Writing;

namespace BcPrep.Tests.Cli;

/// <summary>
/// The logs hashed from the start of a command (<see cref="EarlyFingerprints"/>) give the fingerprints hashing them
/// later gives, and only plain files are hashed early.
/// </summary>
public sealed class EarlyFingerprintsTests
{
    // SHA-256("abc"): FIPS 180-2, appendix B.1 (one-block message).
    private const string AbcSha256 = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";

    [Fact]
    public void A_file_hashed_early_has_the_fingerprint_of_its_bytes()
    {
        using var temp = new TempFolder();
        var path = temp.File("abc.csv");
        File.WriteAllText(path, "abc");

        var early = EarlyFingerprints.Start([path]);
        var fingerprint = early.For(LogInput.FromPath(path));

        Assert.Equal(new InputFingerprint(path, 3, AbcSha256), fingerprint);
        Assert.Equal(LogArguments.Fingerprint(path, path), fingerprint);
    }

    [Fact]
    public void An_input_not_hashed_early_is_hashed_when_asked_for()
    {
        using var temp = new TempFolder();
        var path = temp.File("abc.csv");
        File.WriteAllText(path, "abc");

        // Standard input's copy: another display name than its path, and not among the arguments hashed early.
        var fingerprint = EarlyFingerprints.Start(["-"]).For(new LogInput("(standard input)", path));

        Assert.Equal(new InputFingerprint("(standard input)", 3, AbcSha256), fingerprint);
    }

    [Fact]
    public void A_file_that_cannot_be_read_fails_with_its_usual_message_when_asked_for()
    {
        using var temp = new TempFolder();
        var missing = temp.File("missing.csv");

        var failure = Assert.Throws<BcPrepFailure>(() => EarlyFingerprints.Start([missing]).For(LogInput.FromPath(missing)));

        Assert.Equal(FailureKind.InputData, failure.Kind);
        Assert.StartsWith("cannot read: ", failure.Problems[0].Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Only_files_with_bytes_are_plain_files()
    {
        using var temp = new TempFolder();
        var full = temp.File("full.csv");
        File.WriteAllText(full, "abc");
        var empty = temp.File("empty.csv");
        File.WriteAllText(empty, "");

        // Linux only: elsewhere the file's type is not asked and nothing is hashed early.
        Assert.Equal(OperatingSystem.IsLinux(), EarlyFingerprints.IsPlainFile(full));
        Assert.False(EarlyFingerprints.IsPlainFile("-"));
        Assert.False(EarlyFingerprints.IsPlainFile(empty));
        Assert.False(EarlyFingerprints.IsPlainFile(temp.Path));
        Assert.False(EarlyFingerprints.IsPlainFile(temp.File("missing.csv")));
    }

    [Fact]
    public void A_named_fifo_is_not_a_plain_file()
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }
        using var temp = new TempFolder();
        var fifo = temp.File("day.fifo");
        using (var mkfifo = Process.Start(new ProcessStartInfo("mkfifo", [fifo]))!)
        {
            mkfifo.WaitForExit();
            Assert.Equal(0, mkfifo.ExitCode);
        }

        Assert.True(File.Exists(fifo));
        // Reading it early would take the bytes the reader needs (and block until a writer comes); .NET says it exists.
        Assert.False(EarlyFingerprints.IsPlainFile(fifo));
    }
    // A file of several chunks, hashed in turns by two threads (the early one and the one that asks), each chunk once and
    // in order: the fingerprint of its bytes, as hashing it in one go gives.
    [Fact]
    public async Task A_file_hashed_partly_early_and_finished_by_the_caller_has_the_fingerprint_of_its_bytes()
    {
        using var temp = new TempFolder();
        var path = temp.File("day.csv");
        var bytes = new byte[(5 << 20) / 2];
        new Random(7).NextBytes(bytes);
        File.WriteAllBytes(path, bytes);
        var expected = new InputFingerprint(path, bytes.Length, Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(bytes)));

        var partly = new ChunkedFingerprint(path, path);
        Assert.True(partly.Advance());
        Assert.Equal(expected, partly.Finish());
        Assert.False(partly.Advance());
        Assert.Equal(expected, partly.Finish());

        var raced = new ChunkedFingerprint(path, path);
        var other = Task.Run(() =>
        {
            while (raced.Advance())
            {
            }
        });
        Assert.Equal(expected, raced.Finish());
        await other;
        Assert.Equal(expected, LogArguments.Fingerprint(path, path));
    }

    // Hashed in the background (a thread of its own, lowered to the lowest priority) and asked for meanwhile: the
    // asking thread takes over where the background stands, for a file hashed early and for standard input's copy.
    [Fact]
    public async Task Inputs_hashed_in_the_background_and_asked_for_have_the_fingerprints_of_their_bytes()
    {
        using var temp = new TempFolder();
        var path = temp.File("day.csv");
        var copy = temp.File("stdin-copy.csv");
        var bytes = new byte[3 << 20];
        new Random(8).NextBytes(bytes);
        File.WriteAllBytes(path, bytes);
        File.WriteAllBytes(copy, bytes[..1000]);
        LogInput[] inputs = [LogInput.FromPath(path), new LogInput("(standard input)", copy)];

        var early = EarlyFingerprints.Start([path]);
        var background = Task.Factory.StartNew(() => early.HashInBackground(inputs), CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);
        var fingerprints = inputs.Select(early.For).ToList();
        await background;

        Assert.Equal(LogArguments.Fingerprint(path, path), fingerprints[0]);
        Assert.Equal(new InputFingerprint("(standard input)", 1000, Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(bytes[..1000]))), fingerprints[1]);
    }

    [Fact]
    public void A_file_the_chunks_cannot_read_gives_no_fingerprint_and_is_left_to_the_usual_report()
    {
        using var temp = new TempFolder();

        Assert.Null(new ChunkedFingerprint("missing.csv", temp.File("missing.csv")).Finish());
    }
}
