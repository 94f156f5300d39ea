using System.Globalization;
using CompAssist.Core.Discrete;
using CompAssist.Core.Export;
using CompAssist.Core.Parsing;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Reliability;

/// <summary>
/// The generated C runs its test vectors under the compiler's undefined-behaviour and address sanitizers
/// (-fsanitize=undefined,address -fno-sanitize-recover=all): any signed overflow, shift of a negative value,
/// out-of-bounds access or misaligned load aborts the run.
/// </summary>
public class SanitizerTests
{
    private static void CompileAndRun(string name, string header, string source, string main)
    {
        var directory = Directory.CreateTempSubdirectory("compassist-san-").FullName;
        try
        {
            File.WriteAllText(Path.Combine(directory, name + ".h"), header);
            File.WriteAllText(Path.Combine(directory, name + ".c"), source);
            File.WriteAllText(Path.Combine(directory, "main.c"), main);
            CCompiler.Compile(directory, "-g -fsanitize=undefined,address -fno-sanitize-recover=all", $"main.c {name}.c");
            var run = CCompiler.Run(Path.Combine(directory, "test"), string.Empty, directory, new Dictionary<string, string> { ["ASAN_OPTIONS"] = "detect_leaks=0" });
            Assert.True(run.Code == 0, run.Error);
            Assert.DoesNotContain("runtime error", run.Error, StringComparison.Ordinal);
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
