using System.Diagnostics;

namespace VolCast.IO.Tests;

// Only regular files are read: a pipe would block the reader, a device would never end (common practice, no source).
public sealed class InputFilesTests : IDisposable
{
    private readonly string _work = Directory.CreateTempSubdirectory("volcast-inputfiles-").FullName;

    public void Dispose() => Directory.Delete(_work, recursive: true);

    [Fact]
    public void PriceReader_NamedPipe_RefusedWithoutOpeningIt()
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }

        var pipe = Path.Combine(_work, "pipe.csv");
        using (var mkfifo = Process.Start(new ProcessStartInfo("mkfifo", [pipe]) { UseShellExecute = false })!)
        {
            mkfifo.WaitForExit();
        }

        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(pipe));

        Assert.Contains("named pipe (FIFO), not a regular file", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void PriceReader_LinkToDevZero_RefusedAsADevice()
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }

        var link = Path.Combine(_work, "zero.csv");
        File.CreateSymbolicLink(link, "/dev/zero");

        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(link));

        Assert.Contains("character device", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void ReadCapped_FileOverTheCap_RefusedNamingTheCap()
    {
        var path = Path.Combine(_work, "big.json");
        File.WriteAllBytes(path, new byte[InputFiles.MaxConfigBytes + 1]);

        var error = Assert.Throws<InputDataException>(() => InputFiles.ReadCapped(path, "a JSON configuration file", InputFiles.MaxConfigBytes));

        Assert.Contains("at most 1048576 bytes", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void ConfigReader_Folder_SaysItIsAFolder()
    {
        var error = Assert.Throws<InputDataException>(() => VolCast.IO.Config.BacktestConfigFile.Read(_work));

        Assert.Contains("this is a folder", error.Message, StringComparison.Ordinal);
    }
}
