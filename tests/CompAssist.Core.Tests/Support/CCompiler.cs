using System.Diagnostics;

namespace CompAssist.Core.Tests.Support;

/// <summary>The machine's C compiler and a way to run programs, for the tests that compile exported code.</summary>
internal static class CCompiler
{
    /// <summary>The first of cc, gcc, clang found (.ci/run installs gcc when none is).</summary>
    public static string Path() =>
        new[] { "/usr/bin/cc", "/usr/bin/gcc", "/usr/bin/clang" }.FirstOrDefault(File.Exists)
        ?? throw new InvalidOperationException("No C compiler found; .ci/run installs gcc when it is missing.");

    /// <summary>Runs a program and returns its exit code, standard output and standard error.</summary>
    public static (int Code, string Output, string Error) Run(string file, string arguments, string directory, IReadOnlyDictionary<string, string>? environment = null)
    {
        var info = new ProcessStartInfo(file, arguments) { WorkingDirectory = directory, RedirectStandardOutput = true, RedirectStandardError = true };
        foreach (var (key, value) in environment ?? new Dictionary<string, string>())
        {
            info.Environment[key] = value;
        }

        using var process = Process.Start(info)!;
        var output = process.StandardOutput.ReadToEndAsync();
        var error = process.StandardError.ReadToEndAsync();
        process.WaitForExit();
        return (process.ExitCode, output.Result, error.Result);
    }

    /// <summary>The warning set every generated C file must pass (the hand-off's promise to firmware).</summary>
    public const string StrictFlags = "-std=c99 -Wall -Wextra -Wpedantic -Wunused-macros -Wconversion -Werror";

    /// <summary>
    /// Compiles every generated source (each .c file in <paramref name="sources"/> except the test's main.c) alone under
    /// <see cref="StrictFlags"/>, then links the test program with -std=c99 -Wall -Wextra -Werror -pedantic plus
    /// <paramref name="flags"/>; asserts success.
    /// </summary>
    public static void Compile(string directory, string flags, string sources)
    {
        foreach (var generated in sources.Split(' ', StringSplitOptions.RemoveEmptyEntries).Where(s => s.EndsWith(".c", StringComparison.Ordinal) && s != "main.c"))
        {
            var (strictCode, _, strictError) = Run(Path(), $"{StrictFlags} {flags} -c -o {generated}.o {generated}", directory);
            Assert.True(strictCode == 0, $"{generated} under {StrictFlags}:\n{strictError}");
        }

        var (code, _, error) = Run(Path(), $"-std=c99 -Wall -Wextra -Werror -pedantic {flags} -o test {sources}", directory);
        Assert.True(code == 0, error);
    }

    /// <summary>
    /// Writes <paramref name="files"/> (name → text, the generated code and the test's main.c) to a fresh folder,
    /// compiles them with <see cref="Compile"/> and returns the program's standard output lines; the folder is removed.
    /// </summary>
    public static string[] BuildAndRun(IReadOnlyDictionary<string, string> files, string flags = "-O2")
    {
        var directory = Directory.CreateTempSubdirectory("compassist-c-").FullName;
        try
        {
            foreach (var (name, text) in files)
            {
                File.WriteAllText(System.IO.Path.Combine(directory, name), text);
            }

            Compile(directory, flags, string.Join(' ', files.Keys.Where(k => k.EndsWith(".c", StringComparison.Ordinal))));
            return Run(System.IO.Path.Combine(directory, "test"), string.Empty, directory).Output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        }
        finally
        {
            Directory.Delete(directory, recursive: true);
        }
    }
}
