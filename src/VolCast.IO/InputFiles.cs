using System.Globalization;
using System.Runtime.InteropServices;

namespace VolCast.IO;

/// <summary>
/// Checks an input path before it is opened: only a regular file (or a symbolic link to one) is ever read, so a named
/// pipe, a device such as <c>/dev/zero</c> or a socket is refused at once instead of hanging the run or reading without
/// end; and every read stops at a size cap.
/// </summary>
internal static class InputFiles
{
    /// <summary>Largest configuration file read: 1 MiB (a full configuration is about 1 KB).</summary>
    public const int MaxConfigBytes = 1024 * 1024;

    private const int KindMask = 0xF000;
    private const int RegularKind = 0x8000;
    private const int DirectoryKind = 0x4000;

    /// <summary>Refuses a path that is missing, a folder, or not a regular file, before anything opens it.</summary>
    /// <param name="path">The path as the user gave it (used as given in messages).</param>
    /// <param name="what">What the file should be, for messages, such as "a CSV file" or "a JSON configuration file".</param>
    /// <exception cref="InputDataException">The path is empty, missing, a folder, or a pipe, device or socket.</exception>
    public static void RequireRegular(string path, string what)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(what);
        if (string.IsNullOrWhiteSpace(path))
        {
            throw new InputDataException(path, null, null, "file not found: the path is empty; give the path of " + what + ".");
        }

        if (Directory.Exists(path))
        {
            throw new InputDataException(path, null, null, "this is a folder, not a file; give the path of " + what + ".");
        }

        if (!File.Exists(path))
        {
            throw new InputDataException(path, null, null, "file not found; check the path and that the file exists.");
        }

        if (KindOf(path) is int kind && (kind & KindMask) != RegularKind && (kind & KindMask) != DirectoryKind)
        {
            throw new InputDataException(path, null, null, "this is " + KindName(kind & KindMask)
                + ", not a regular file; VolCast reads only regular files (a pipe or device could block or never end). Give the path of " + what + ".");
        }
    }

    /// <summary>Reads a regular file's bytes, at most <paramref name="maxBytes"/> of them.</summary>
    /// <param name="path">The path as the user gave it.</param>
    /// <param name="what">What the file should be, for messages.</param>
    /// <param name="maxBytes">The cap; a longer file is refused without reading past the cap.</param>
    /// <returns>The bytes.</returns>
    /// <exception cref="InputDataException">The file is not a readable regular file, or is longer than the cap.</exception>
    public static byte[] ReadCapped(string path, string what, long maxBytes)
    {
        RequireRegular(path, what);
        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
            var length = stream.Length;
            if (length > maxBytes)
            {
                throw TooLarge(path, length, maxBytes, what);
            }

            // Read up to the cap plus one byte, whatever the length said: a file that grows while it is read is still bounded.
            var buffer = new byte[length + 1];
            var total = 0;
            while (true)
            {
                if (total == buffer.Length)
                {
                    if (buffer.Length > maxBytes)
                    {
                        throw TooLarge(path, buffer.Length, maxBytes, what);
                    }

                    Array.Resize(ref buffer, (int)Math.Min(maxBytes + 1, Math.Max(4096, 2L * buffer.Length)));
                }

                var read = stream.Read(buffer, total, buffer.Length - total);
                if (read == 0)
                {
                    break;
                }

                total += read;
            }

            return total == buffer.Length ? buffer : buffer[..total];
        }
        catch (Exception e) when (e is FileNotFoundException or DirectoryNotFoundException)
        {
            throw new InputDataException(path, null, null, "file not found; check the path and that the file exists.");
        }
        catch (UnauthorizedAccessException)
        {
            throw new InputDataException(path, null, null, "permission denied: the file cannot be read by this user; check its permissions.");
        }
        catch (Exception e) when (e is IOException or NotSupportedException or ArgumentException)
        {
            throw new InputDataException(path, null, null, "the file could not be read (" + e.Message + "); check that it exists and is readable.");
        }
    }

    private static InputDataException TooLarge(string path, long length, long maxBytes, string what) =>
        new(path, null, null, string.Create(CultureInfo.InvariantCulture,
            $"the file is {(length > maxBytes ? "over" : "at least")} {maxBytes} bytes{(length > maxBytes ? $" ({length} bytes)" : string.Empty)}; expected {what} of at most {maxBytes} bytes."));

    private static string KindName(int kind) => kind switch
    {
        0x1000 => "a named pipe (FIFO)",
        0x2000 => "a character device",
        0x6000 => "a block device",
        0xC000 => "a socket",
        _ => "a special file",
    };

    /// <summary>The file's type bits from stat (links followed), or null where they cannot be read (not a Unix system).</summary>
    private static int? KindOf(string path)
    {
        if (OperatingSystem.IsWindows())
        {
            return null;
        }

        try
        {
            // The runtime's own native shim: its status record starts with two 32-bit fields, flags then mode, whose
            // type bits are the POSIX ones (0x8000 regular, 0x4000 folder, 0x1000 FIFO, 0x2000 character device).
            var status = new byte[256];
            return Native.Stat(path, status) == 0 ? BitConverter.ToInt32(status, 4) : null;
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            return null;
        }
    }

    private static class Native
    {
        [DllImport("libSystem.Native", EntryPoint = "SystemNative_Stat", ExactSpelling = true)]
        [DefaultDllImportSearchPaths(DllImportSearchPath.SafeDirectories)]
        public static extern int Stat([MarshalAs(UnmanagedType.LPUTF8Str)] string path, [Out] byte[] status);
    }
}
