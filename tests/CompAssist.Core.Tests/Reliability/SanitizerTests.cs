using System.Diagnostics;
using System.Globalization;
using CompAssist.Core.Discrete;
using CompAssist.Core.Export;
using CompAssist.Core.Parsing;
using CompAssist.Core.Synthesis;

namespace CompAssist.Core.Tests.Reliability;

/// <summary>
/// The generated C runs its test vectors under the compiler's undefined-behaviour and address sanitizers
/// (-fsanitize=undefined,address -fno-sanitize-recover=all): any signed overflow, shift of a negative value,
/// out-of-bounds access or misaligned load aborts the run.
/// </summary>
public class SanitizerTests
{
    private static string Compiler() => new[] { "/usr/bin/gcc", "/usr/bin/cc", "/usr/bin/clang" }.First(File.Exists);

    private static void CompileAndRun(string name, string header, string source, string main)
    {
        var directory = Directory.CreateTempSubdirectory("compassist-san-").FullName;
        try
        {
            File.WriteAllText(Path.Combine(directory, name + ".h"), header);
            File.WriteAllText(Path.Combine(directory, name + ".c"), source);
            File.WriteAllText(Path.Combine(directory, "main.c"), main);
            using (var compile = Process.Start(new ProcessStartInfo(Compiler(), $"-std=c99 -Wall -Wextra -Werror -g -fsanitize=undefined,address -fno-sanitize-recover=all -o test main.c {name}.c") { WorkingDirectory = directory, RedirectStandardError = true })!)
            {
                var error = compile.StandardError.ReadToEnd();
                compile.WaitForExit();
                Assert.True(compile.ExitCode == 0, error);
            }

            var info = new ProcessStartInfo(Path.Combine(directory, "test")) { WorkingDirectory = directory, RedirectStandardOutput = true, RedirectStandardError = true };
            info.Environment["ASAN_OPTIONS"] = "detect_leaks=0";
            using var run = Process.Start(info)!;
            var stderr = run.StandardError.ReadToEndAsync();
            run.StandardOutput.ReadToEnd();
            run.WaitForExit();
            Assert.True(run.ExitCode == 0, stderr.Result);
            Assert.DoesNotContain("runtime error", stderr.Result, StringComparison.Ordinal);
        }
        finally
        {
            Directory.Delete(directory, recursive: true);
        }
    }

    [Theory]
    [InlineData(12)]
    [InlineData(16)]
    [InlineData(24)]
    public void FixedPoint_SaturatingVector_NoUndefinedBehaviour(int word)
    {
        var d = Discretizer.Discretize(ExpressionParser.Parse("20(s+0.5)(s+3)/((s+0.05)(s+30))", false).Value!, 0.002, DiscretizationMethod.Tustin).Value!.Discrete;
        var q = Quantizer.Quantize(d, SectionSplitter.Split(d), NumberFormat.Fixed(word));
        var cascade = FixedPointCascade.Create(q.Sections, word, word / 2);
        var (header, source) = FixedPointCodeGenerator.Generate("q_ctrl", cascade, 0.002, "sanitizer test");
        var max = (1L << (word - 1)) - 1;
        var input = Enumerable.Repeat(max, 300).Concat(Enumerable.Repeat(-max - 1, 300)).Concat(Enumerable.Range(0, 300).Select(k => (k % 7 == 0) ? max : -max - 1));
        var values = string.Join(",", input.Select(v => v.ToString(CultureInfo.InvariantCulture)));
        CompileAndRun("q_ctrl", header, source, "#include <stdio.h>\n#include \"q_ctrl.h\"\nstatic const int32_t in[] = {" + values + "};\nint main(void)\n{\n    q_ctrl_state s;\n    unsigned i;\n    long sum = 0;\n    q_ctrl_init(&s);\n    for (i = 0; i < sizeof in / sizeof in[0]; ++i) {\n        sum += (long)q_ctrl_step(&s, in[i]);\n    }\n    printf(\"%ld\\n\", sum);\n    return 0;\n}\n");
    }

    [Fact]
    public void DoubleAndPid_Vectors_NoUndefinedBehaviour()
    {
        var d = Discretizer.Discretize(ExpressionParser.Parse("4.7(s+2.93)/(s+5.46)", false).Value!, 0.01, DiscretizationMethod.Zoh).Value!.Discrete;
        var (header, source) = CCodeGenerator.Generate("d_ctrl", SectionSplitter.Split(d), 0.01, "sanitizer test");
        CompileAndRun("d_ctrl", header, source, "#include <stdio.h>\n#include \"d_ctrl.h\"\nint main(void)\n{\n    d_ctrl_state s;\n    int i;\n    double sum = 0.0;\n    d_ctrl_init(&s);\n    for (i = 0; i < 1000; ++i) {\n        sum += d_ctrl_step(&s, (i % 50) < 25 ? 1e6 : -1e6);\n    }\n    printf(\"%g\\n\", sum);\n    return 0;\n}\n");

        var pid = new PidImplementation(PidForms.FromParallel(2, 1.5, 0.4, 0.04), 0.01, -1, 1, AntiWindup.BackCalculation);
        var (ph, ps) = PidCodeGenerator.Generate("p_ctrl", pid, "sanitizer test");
        CompileAndRun("p_ctrl", ph, ps, "#include <stdio.h>\n#include \"p_ctrl.h\"\nint main(void)\n{\n    p_ctrl_state s;\n    int i;\n    double sum = 0.0;\n    p_ctrl_init(&s);\n    for (i = 0; i < 1000; ++i) {\n        sum += p_ctrl_step(&s, (i % 100) < 50 ? 10.0 : -10.0, 0.001 * i);\n    }\n    printf(\"%g\\n\", sum);\n    return 0;\n}\n");
    }
}
