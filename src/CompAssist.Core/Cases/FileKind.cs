using System.Runtime.InteropServices;

namespace CompAssist.Core.Cases;

/// <summary>
/// What sits at a path, without following a link: nothing, a regular file, a directory, a symbolic link, or
/// something else (a FIFO, a device, a socket). On Linux from statx(2) (its layout is the same on every
/// architecture); elsewhere from the file attributes, which cannot tell a FIFO or a device from a file.
/// </summary>
internal static class FileKind
{
    private const int AtFdCwd = -100;
    private const int AtSymlinkNoFollow = 0x100;
    private const uint StatxType = 0x1;
    private const int ModeOffset = 28;

    public enum Kind
    {
        Missing,
        Regular,
        Directory,
        Link,
        Other,
    }

    public static Kind Of(string path)
    {
        if (OperatingSystem.IsLinux())
        {
            var buffer = new byte[256];
            try
            {
                if (Statx(AtFdCwd, path, AtSymlinkNoFollow, StatxType, buffer) == 0)
                {
                    var mode = BitConverter.ToUInt16(buffer, ModeOffset) & 0xF000;
                    return mode switch
                    {
                        0x8000 => Kind.Regular,
                        0x4000 => Kind.Directory,
                        0xA000 => Kind.Link,
                        _ => Kind.Other,
                    };
                }

                return Kind.Missing;
            }
            catch (Exception e) when (e is EntryPointNotFoundException or DllNotFoundException)
            {
                // A C library without statx (older than glibc 2.28): fall through to the attributes.
            }
        }

        var info = new FileInfo(path);
        if (info.LinkTarget is not null)
        {
            return Kind.Link;
        }

        return Directory.Exists(path) ? Kind.Directory : info.Exists ? Kind.Regular : Kind.Missing;
    }

    [DllImport("libc", EntryPoint = "statx")]
    [DefaultDllImportSearchPaths(DllImportSearchPath.SafeDirectories)]
    private static extern int Statx(int dirfd, [MarshalAs(UnmanagedType.LPUTF8Str)] string path, int flags, uint mask, [Out] byte[] buffer);
}
