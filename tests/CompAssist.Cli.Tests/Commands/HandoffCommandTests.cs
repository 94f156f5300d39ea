using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using CompAssist.Cli.Tests.Support;

namespace CompAssist.Cli.Tests.Commands;

public class HandoffCommandTests
{
    private static (int Code, string Output, string Error) Run(string file, string arguments, string directory)
    {
        using var process = Process.Start(new ProcessStartInfo(file, arguments) { WorkingDirectory = directory, RedirectStandardOutput = true, RedirectStandardError = true })!;
        var output = process.StandardOutput.ReadToEndAsync();
        var error = process.StandardError.ReadToEndAsync();
        process.WaitForExit();
        return (process.ExitCode, output.Result, error.Result);
    }

    [Fact]
    public void Handoff_DemoCase_WritesFilesAndTheCodeMatchesItsVectors()
    {
        var folder = Directory.CreateTempSubdirectory("compassist-handoff-").FullName;
        try
        {
            var file = Path.Combine(CliRunner.RepositoryRoot(), "cases", "belt-axis.toml");
            var (code, output, error) = CliRunner.Run("handoff", file, "--out", folder, "--sample-time", "0.005", "--name", "belt_axis");
            Assert.True(code == 0 ? output.Contains("continuous loop: MEETS", StringComparison.Ordinal) : code == 4 && output.Contains("FAILS", StringComparison.Ordinal), error + output);
            foreach (var name in new[] { "belt_axis.h", "belt_axis.c", "belt_axis.json", "belt_axis-vectors.csv", "belt_axis-report.md", "belt_axis-step.svg", "belt_axis-poles.svg" })
            {
                Assert.True(File.Exists(Path.Combine(folder, name)), name);
            }

            foreach (var text in new[] { "belt_axis.h", "belt_axis.json", "belt_axis-report.md", "belt_axis-vectors.csv" }.Select(n => File.ReadAllText(Path.Combine(folder, n))))
            {
                Assert.Contains("safety function", text.Replace("\n * ", " ", StringComparison.Ordinal).Replace("\n# ", " ", StringComparison.Ordinal), StringComparison.Ordinal);
            }

            using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "belt_axis.json")));
            Assert.Equal(0.005, json.RootElement.GetProperty("sampleTime").GetDouble());
            Assert.True(json.RootElement.GetProperty("sampledLoop").GetProperty("stable").GetBoolean());

            // Compile the exported code and run every vector row.
            var rows = File.ReadAllLines(Path.Combine(folder, "belt_axis-vectors.csv")).Where(l => !l.StartsWith('#') && !l.StartsWith("run,", StringComparison.Ordinal))
                .Select(l => l.Split(',')).ToList();
            var program = new System.Text.StringBuilder();
            program.AppendLine("#include <math.h>\n#include <stdio.h>\n#include \"belt_axis.h\"\nint main(void)\n{\n    belt_axis_state s;");
            foreach (var run in rows.GroupBy(r => r[0]))
            {
                program.AppendLine("    belt_axis_init(&s);");
                foreach (var r in run)
                {
                    var input = r[2] switch { "nan" => "NAN", "inf" => "INFINITY", "-inf" => "-INFINITY", var v => v };
                    program.AppendLine(CultureInfo.InvariantCulture, $"    printf(\"%.17g\\n\", belt_axis_step(&s, {input}));");
                }
            }

            program.AppendLine("    return s.fault == 1 ? 0 : 99; /* the last run fed nan and inf: the fault flag must be set */\n}");
            File.WriteAllText(Path.Combine(folder, "main.c"), program.ToString());
            var compiler = new[] { "/usr/bin/cc", "/usr/bin/gcc", "/usr/bin/clang" }.First(File.Exists);
            var strict = Run(compiler, "-std=c99 -Wall -Wextra -Wpedantic -Wunused-macros -Wconversion -Werror -c -o belt_axis.o belt_axis.c", folder);
            Assert.True(strict.Code == 0, strict.Error);
            var compile = Run(compiler, "-std=c99 -Wall -Wextra -Werror -pedantic -o test main.c belt_axis.c", folder);
            Assert.True(compile.Code == 0, compile.Error);
            var ran = Run(Path.Combine(folder, "test"), string.Empty, folder);
            Assert.True(ran.Code == 0, $"the fault flag was not set after nan and inf inputs (exit {ran.Code})");
            var outputs = ran.Output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
            Assert.Equal(rows.Count, outputs.Length);
            for (var i = 0; i < rows.Count; i++)
            {
                var expected = double.Parse(rows[i][3], CultureInfo.InvariantCulture);
                var actual = double.Parse(outputs[i], CultureInfo.InvariantCulture);
                Assert.True(Math.Abs(expected - actual) <= 1e-12 * Math.Max(1, Math.Abs(expected)), $"row {i}: {expected} vs {actual}");
            }
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    [Fact]
    public void Handoff_PidCase_ExportsPidCodeAndSaturatingVectors()
    {
        var folder = Directory.CreateTempSubdirectory("compassist-handoff-pid-").FullName;
        try
        {
            var file = Path.Combine(CliRunner.RepositoryRoot(), "cases", "heater-stage.toml");
            var (code, output, error) = CliRunner.Run("handoff", file, "--out", folder, "--name", "heater", "--anti-windup", "back-calculation");
            Assert.True(code == 0 ? output.Contains("continuous loop: MEETS", StringComparison.Ordinal) : code == 4 && output.Contains("FAILS", StringComparison.Ordinal), error + output);
            Assert.Contains("anti-windup: BackCalculation", File.ReadAllText(Path.Combine(folder, "heater_pid.h")), StringComparison.Ordinal);
            var rows = File.ReadAllLines(Path.Combine(folder, "heater_pid-vectors.csv")).Where(l => char.IsAsciiDigit(l[0])).Select(l => double.Parse(l.Split(',')[3], CultureInfo.InvariantCulture)).ToList();
            Assert.Equal(400, rows.Count);
            Assert.Contains(100.0, rows);
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    [Fact]
    public void Handoff_FixedPoint_WritesBitExactCodeAndIntegerVectors()
    {
        var folder = Directory.CreateTempSubdirectory("compassist-handoff-fixed-").FullName;
        try
        {
            var file = Path.Combine(CliRunner.RepositoryRoot(), "cases", "belt-axis.toml");
            var (code, output, error) = CliRunner.Run("handoff", file, "--out", folder, "--sample-time", "0.001", "--format", "fixed16", "--name", "belt");
            Assert.True(code is 0 or 4, error);
            Assert.Contains("fixed16: quantization analysed", output, StringComparison.Ordinal);
            Assert.Contains("int64_t", File.ReadAllText(Path.Combine(folder, "belt.c")), StringComparison.Ordinal);
            Assert.Contains("saturating,0,32767,", File.ReadAllText(Path.Combine(folder, "belt-vectors.csv")), StringComparison.Ordinal);
            using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "belt.json")));
            Assert.Equal("fixed16", json.RootElement.GetProperty("format").GetString());
            Assert.True(json.RootElement.GetProperty("quantization").GetProperty("largestPoleShift").GetDouble() > 0);
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    [Fact]
    public void Handoff_HeaterPidInFixedPoint_WritesIntegerPidCodeAndSaysWhatItMeets()
    {
        // A stricter overshoot than the demo's makes the continuous loop fail its settling time: the exported PID's
        // verdict must say it keeps what the continuous loop meets, not plain "meets".
        var folder = Directory.CreateTempSubdirectory("compassist-handoff-fixed-pid-").FullName;
        try
        {
            var file = Path.Combine(CliRunner.RepositoryRoot(), "cases", "heater-stage.toml");
            var (code, output, error) = CliRunner.Run("handoff", file, "--out", folder, "--format", "fixed16", "--derivative-on", "error", "--overshoot", "0.5", "--name", "heat");
            Assert.True(code == 4, error);
            Assert.Contains("PID as exported: meets what the continuous loop meets (the continuous loop fails 1 requirement)", output, StringComparison.Ordinal);
            Assert.Contains("int32_t heat_pid_step(heat_pid_state *state, int32_t reference, int32_t measurement);", File.ReadAllText(Path.Combine(folder, "heat_pid.h")), StringComparison.Ordinal);
            using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "heat.json")));
            var pid = json.RootElement.GetProperty("pidAsExported");
            Assert.Equal("fixed16", pid.GetProperty("arithmetic").GetString());
            Assert.Equal(8, pid.GetProperty("outputFractionBits").GetInt32());
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    [Fact]
    public void Handoff_GivenSampleTimeFailsSampled_ExitFourWithThePackageWrittenAndTheValueThatMeets()
    {
        // The belt-axis demo sampled at 0.2 s overshoots well beyond its 10 % (about 17 % at the instants):
        // the package is still written (the firmware engineer may want to see it), the exit code says it fails.
        var folder = Directory.CreateTempSubdirectory("compassist-handoff-").FullName;
        try
        {
            var file = Path.Combine(CliRunner.RepositoryRoot(), "cases", "belt-axis.toml");
            var (code, output, error) = CliRunner.Run("handoff", file, "--out", folder, "--sample-time", "0.2");
            Assert.True(code == 4, error + output);
            Assert.Contains("sampled at T = 0.2 s: overshoot %", output, StringComparison.Ordinal);
            Assert.Contains("meets", output, StringComparison.Ordinal);
            Assert.True(File.Exists(Path.Combine(folder, "compassist_ctrl-report.md")));
            var report = File.ReadAllText(Path.Combine(folder, "compassist_ctrl-report.md"));
            Assert.Contains("## Sample time: the ladder re-proved", report, StringComparison.Ordinal);
            Assert.Contains("**0.2** (this package)", report, StringComparison.Ordinal);

            var (recommendedCode, recommended, _) = CliRunner.Run("handoff", file, "--out", folder);
            Assert.Equal(0, recommendedCode);
            Assert.Contains("recommended: T = ", recommended, StringComparison.Ordinal);
        }
        finally
        {
            Directory.Delete(folder, true);
        }
    }

    [Fact]
    public void Handoff_ImproperPid_RefusedWithFix()
    {
        var folder = Path.Combine(Path.GetTempPath(), $"compassist-never-{Guid.NewGuid():N}");
        var (code, _, error) = CliRunner.Run("handoff", "--plant", "1/(s(s+1)(s+5))", "--type", "pid", "--zeta", "0.5", "--wn", "1", "--out", folder);
        Assert.Equal(3, code);
        Assert.Contains("filter", error, StringComparison.Ordinal);
        Assert.False(Directory.Exists(folder));
    }

    [Fact]
    public void Handoff_NoOut_Refused()
    {
        var (code, _, error) = CliRunner.Run("handoff", "--plant", "1/(s(s+1))", "--zeta", "0.5", "--wn", "1");
        Assert.Equal(2, code);
        Assert.Contains("--out DIR is required", error, StringComparison.Ordinal);
    }
}
