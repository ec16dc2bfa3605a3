using System.IO.Compression;
using System.Text;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Reading;

/// <summary>
/// A gzip log cut short must be refused, not read as a shorter day (RFC 1952: every member ends with CRC-32 and
/// length; a stream that ends before them is incomplete). Whole files, concatenated members and a cut exactly
/// between members (which is two complete members, as `gzip -t` also finds) read in full.
/// </summary>
public class CheckedGzipStreamTests
{
    private static readonly LogFormat Seconds = new("t", TimeFormat.Seconds, null, '.');

    private static byte[] Gzip(string text)
    {
        using var memory = new MemoryStream();
        using (var gz = new GZipStream(memory, CompressionLevel.Optimal, leaveOpen: true))
        {
            gz.Write(Encoding.UTF8.GetBytes(text));
        }
        return memory.ToArray();
    }

    private static string Log(int rows, int from = 0) =>
        string.Concat(Enumerable.Range(from, rows).Select(i => $"{i},{(i * 0.37 % 5).ToString("R", System.Globalization.CultureInfo.InvariantCulture)}\n"));

    private static int ReadRows(string path)
    {
        using var reader = new LogFileReader(LogInput.FromPath(path), Seconds, ["a"]);
        var block = new LogBlock(1, 1000);
        var rows = 0;
        while (reader.ReadBlock(block))
        {
            rows += block.Count;
        }
        return rows;
    }

    [Fact]
    public void A_whole_file_and_concatenated_members_read_every_row()
    {
        using var files = new TempFiles();
        var one = Gzip("t,a\n" + Log(20000));
        var second = Gzip(Log(5000, from: 20000));
        Assert.Equal(20000, ReadRows(files.WriteBytes("one.csv.gz", one)));
        Assert.Equal(25000, ReadRows(files.WriteBytes("two.csv.gz", [.. one, .. second])));
    }

    [Theory]
    [InlineData(1)]   // inside the 8-byte trailer (CRC-32 and length)
    [InlineData(8)]   // the whole trailer missing, deflate data complete
    [InlineData(500)] // mid-stream
    public void A_file_cut_short_is_refused_as_truncated_naming_the_file(int bytesCut)
    {
        using var files = new TempFiles();
        var whole = Gzip("t,a\n" + Log(20000));
        var path = files.WriteBytes("cut.csv.gz", whole[..^bytesCut]);

        var failure = Assert.Throws<BcPrepFailure>(() => ReadRows(path));

        Assert.Contains("the gzip file is truncated", failure.Message, StringComparison.Ordinal);
        Assert.Contains("cut.csv.gz:", failure.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_second_member_cut_short_is_refused()
    {
        using var files = new TempFiles();
        var one = Gzip("t,a\n" + Log(20000));
        var second = Gzip(Log(5000, from: 20000));
        var path = files.WriteBytes("two.csv.gz", [.. one, .. second[..^20]]);

        var failure = Assert.Throws<BcPrepFailure>(() => ReadRows(path));

        Assert.Contains("truncated", failure.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_flipped_crc_is_refused_as_corrupt()
    {
        using var files = new TempFiles();
        var whole = Gzip("t,a\n" + Log(20000));
        whole[^6] ^= 0x01;
        var path = files.WriteBytes("crc.csv.gz", whole);

        var failure = Assert.Throws<BcPrepFailure>(() => ReadRows(path));

        Assert.Contains("the gzip data is corrupt (a CRC-32 or length check failed", failure.Message, StringComparison.Ordinal);
    }
}
