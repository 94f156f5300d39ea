using System.Diagnostics;
using CompAssist.Core.Cases;

namespace CompAssist.Core.Tests.Cases;

/// <summary>The one safe writer against a hostile shared folder: planted links, FIFOs, devices, permission bits, leftovers.</summary>
public sealed class AtomicFileTests : IDisposable
{
    private readonly string folder = Directory.CreateTempSubdirectory("ca-atomic-").FullName;

    public void Dispose() => Directory.Delete(folder, true);

    private string In(string name) => Path.Combine(folder, name);

    [Fact]
    public void Write_LinksPlantedAtEveryFixedTemporaryName_NeverWrittenThrough()
    {
        // Another user plants links where a predictable temporary name would be: the old fixed names
        // (NAME.tmp, NAME.<pid>-<n>.tmp). The writer's random, exclusively created name never meets them.
        var victim = In("victim.txt");
        File.WriteAllText(victim, "precious");
        var target = In("case.toml");
        foreach (var n in Enumerable.Range(1, 20))
        {
            File.CreateSymbolicLink($"{target}.{Environment.ProcessId}-{n}.tmp", victim);
        }

        File.CreateSymbolicLink(target + ".tmp", victim);
        AtomicFile.Write(target, "new");
        Assert.Equal("new", File.ReadAllText(target));
        Assert.Equal("precious", File.ReadAllText(victim));
    }

    [Fact]
    public void Write_LinkAtTheTarget_ReplacedNotFollowedUnlessAsked()
    {
        var victim = In("victim.txt");
        File.WriteAllText(victim, "precious");
        var plot = In("plot.svg");
        File.CreateSymbolicLink(plot, victim);
        AtomicFile.Write(plot, "<svg/>");
        Assert.Null(new FileInfo(plot).LinkTarget);
        Assert.Equal("<svg/>", File.ReadAllText(plot));
        Assert.Equal("precious", File.ReadAllText(victim));

        // The case file the user opened through a link is saved to the link's target, keeping the link.
        var real = In("real.toml");
        File.WriteAllText(real, "old");
        var opened = In("opened.toml");
        File.CreateSymbolicLink(opened, real);
        AtomicFile.Write(opened, "saved", followLink: true);
        Assert.NotNull(new FileInfo(opened).LinkTarget);
        Assert.Equal("saved", File.ReadAllText(real));
    }

    [Fact]
    public void Write_FifoOrDeviceOrFolderAtTheTarget_RefusedAndLeftInPlace()
    {
        Assert.Throws<IOException>(() => AtomicFile.Write(folder, "x"));
        if (!OperatingSystem.IsLinux())
        {
            return; // FIFOs and devices are told apart from files only on Linux (statx)
        }

        var fifo = In("fifo.svg");
        using (var mk = Process.Start("mkfifo", fifo))
        {
            mk.WaitForExit();
        }

        var e = Assert.Throws<IOException>(() => AtomicFile.Write(fifo, "x"));
        Assert.Contains("not a regular file", e.Message, StringComparison.Ordinal);
        Assert.Equal(FileKind.Kind.Other, FileKind.Of(fifo));
        Assert.Throws<IOException>(() => AtomicFile.Write("/dev/null", "x"));
        Assert.Empty(AtomicFile.LeftoversBeside(fifo));
    }

    [Fact]
    public void Write_ExistingFile_PermissionBitsKept()
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }

        var file = In("private.toml");
        File.WriteAllText(file, "old");
        File.SetUnixFileMode(file, UnixFileMode.UserRead | UnixFileMode.UserWrite);
        AtomicFile.Write(file, "new");
        Assert.Equal(UnixFileMode.UserRead | UnixFileMode.UserWrite, File.GetUnixFileMode(file));
    }

    [Fact]
    public void Write_InterruptedBeforeTheRename_OldFileIntactAndTheTemporaryRemovedAtTheNextStart()
    {
        var file = In("case.toml");
        File.WriteAllText(file, "old");
        Assert.Throws<IOException>(() => AtomicFile.Write(file, "new", () => throw new IOException("killed")));
        Assert.Equal("old", File.ReadAllText(file));
        Assert.Empty(AtomicFile.LeftoversBeside(file));

        // A killed process leaves its temporary behind: the next start removes it.
        File.WriteAllText(file + ".0123456789abcdef.tmp", "partial");
        Assert.Equal(1, AtomicFile.RemoveLeftovers(file));
        Assert.Empty(AtomicFile.LeftoversBeside(file));
        Assert.Equal("old", File.ReadAllText(file));
    }
}
