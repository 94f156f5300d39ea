using System.Globalization;
using System.Numerics;
using CompAssist.Core.Discrete;
using CompAssist.Core.Export;
using CompAssist.Core.Parsing;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Export;

/// <summary>The exported C is compiled with the machine's C compiler (-std=c99 -Wall -Wextra -Werror) and run on test vectors.</summary>
public class CCodeGeneratorTests
{
    [Theory]
    [InlineData("4.7(s+2.93)/(s+5.46)", 0.01, DiscretizationMethod.Tustin)]
    [InlineData("20(s+0.5)(s+3)/((s+0.05)(s+30))", 0.002, DiscretizationMethod.Prewarp)]
    [InlineData("50(s^2+2s+26)/((s+1)(s+20)(s^2+8s+100))", 0.005, DiscretizationMethod.Zoh)]
    [InlineData("3(s+1)/(s(s+10))", 0.01, DiscretizationMethod.Matched)]
    public void Generate_CompilesCleanlyAndMatchesTheReference(string compensator, double t, DiscretizationMethod method)
    {
        var c = ExpressionParser.Parse(compensator, requireProper: false).Value!;
        var d = Discretizer.Discretize(c, t, method).Value!.Discrete;
        var sections = SectionSplitter.Split(d);

        // Test vectors: impulse, step and a fixed pseudo-random sequence.
        var random = new Random(7);
        var input = new List<double> { 1.0 };
        input.AddRange(Enumerable.Repeat(0.0, 49));
        input.AddRange(Enumerable.Repeat(1.0, 100));
        input.AddRange(Enumerable.Range(0, 100).Select(_ => (2 * random.NextDouble()) - 1));

        // The section cascade is the same filter as the direct form, and the C code reproduces the cascade.
        var direct = d.Filter(input);
        var cascade = SectionSplitter.Filter(sections, input);
        var scale = direct.Max(Math.Abs);
        for (var k = 0; k < input.Count; k++)
        {
            Tolerance.Close(direct[k], cascade[k], 0, 1e-9 * scale, $"cascade k={k}");
        }

        var directory = Directory.CreateTempSubdirectory("compassist-c-").FullName;
        try
        {
            var (header, source) = CCodeGenerator.Generate("axis_ctrl", sections, t, $"C(s) = {c}, {method}");
            File.WriteAllText(Path.Combine(directory, "axis_ctrl.h"), header);
            File.WriteAllText(Path.Combine(directory, "axis_ctrl.c"), source);
            var values = string.Join(",\n", input.Select(v => v.ToString("R", CultureInfo.InvariantCulture)));
            File.WriteAllText(Path.Combine(directory, "main.c"), $$"""
                #include <stdio.h>
                #include "axis_ctrl.h"
                static const double input[] = {
                {{values}}
                };
                int main(void)
                {
                    axis_ctrl_state state;
                    unsigned i;
                    axis_ctrl_init(&state);
                    for (i = 0; i < sizeof input / sizeof input[0]; ++i) {
                        printf("%.17g\n", axis_ctrl_step(&state, input[i]));
                    }
                    return 0;
                }
                """);
            CCompiler.Compile(directory, "-O2", "main.c axis_ctrl.c -lm");
            var run = CCompiler.Run(Path.Combine(directory, "test"), string.Empty, directory);
            Assert.Equal(0, run.Code);
            var outputs = run.Output.Split('\n', StringSplitOptions.RemoveEmptyEntries).Select(v => double.Parse(v, CultureInfo.InvariantCulture)).ToList();
            Assert.Equal(input.Count, outputs.Count);
            for (var k = 0; k < input.Count; k++)
            {
                Tolerance.Close(cascade[k], outputs[k], 1e-12, 1e-14 * scale, $"C output k={k}");
            }
        }
        finally
        {
            Directory.Delete(directory, recursive: true);
        }
    }

    [Fact]
    public void Generate_Float_CompilesAndMatchesSinglePrecisionReference()
    {
        var c = ExpressionParser.Parse("20(s+0.5)(s+3)/((s+0.05)(s+30))", requireProper: false).Value!;
        var d = Discretizer.Discretize(c, 0.002, DiscretizationMethod.Tustin).Value!.Discrete;
        var stored = Quantizer.Quantize(d, SectionSplitter.Split(d), NumberFormat.Float).Sections.Select(q => q.Section).ToList();
        var input = Enumerable.Range(0, 200).Select(k => Math.Sin(0.05 * k)).ToList();
        var reference = SectionSplitter.FilterSingle(stored, input);
        var directory = Directory.CreateTempSubdirectory("compassist-f-").FullName;
        try
        {
            var (header, source) = CCodeGenerator.Generate("f_ctrl", stored, 0.002, "test", NumberFormat.Float);
            Assert.Contains("float s1[", header, StringComparison.Ordinal);
            File.WriteAllText(Path.Combine(directory, "f_ctrl.h"), header);
            File.WriteAllText(Path.Combine(directory, "f_ctrl.c"), source);
            var values = string.Join(",\n", input.Select(v => ((float)v).ToString("0.0########E+0", CultureInfo.InvariantCulture) + "f"));
            File.WriteAllText(Path.Combine(directory, "main.c"), "#include <stdio.h>\n#include \"f_ctrl.h\"\nstatic const float input[] = {\n" + values + "\n};\nint main(void)\n{\n    f_ctrl_state s;\n    unsigned i;\n    f_ctrl_init(&s);\n    for (i = 0; i < sizeof input / sizeof input[0]; ++i) {\n        printf(\"%.9g\\n\", (double)f_ctrl_step(&s, input[i]));\n    }\n    return 0;\n}\n");
            CCompiler.Compile(directory, "-O2", "main.c f_ctrl.c");
            var outputs = CCompiler.Run(Path.Combine(directory, "test"), string.Empty, directory).Output.Split('\n', StringSplitOptions.RemoveEmptyEntries).Select(v => double.Parse(v, CultureInfo.InvariantCulture)).ToList();
            var scale = reference.Max(Math.Abs);
            for (var k = 0; k < input.Count; k++)
            {
                // Float rounding accumulates through the slow pole near z = 1; 1e-4 of the signal is far below any
                // coefficient-quantization effect and far above double rounding.
                Tolerance.Close(reference[k], outputs[k], 1e-4, 1e-4 * scale, $"float k={k}");
            }
        }
        finally
        {
            Directory.Delete(directory, recursive: true);
        }
    }

    [Fact]
    public void Generate_HostileSourceText_CannotCloseTheCommentOrReachTheCode()
    {
        // A case name ending a C comment ("*/") followed by code, with an escape character: the header and the
        // source stay one comment there and compile to nothing extra (C99 6.4.9: "*/" ends a block comment).
        var c = ExpressionParser.Parse("2(s+1)/(s+10)", requireProper: false).Value!;
        var d = Discretizer.Discretize(c, 0.01, DiscretizationMethod.Tustin).Value!.Discrete;
        var (header, source) = CCodeGenerator.Generate("h_ctrl", SectionSplitter.Split(d), 0.01, "evil */ int injected = 1; /* \u001b[31m\u001b");
        Assert.DoesNotContain("evil */", header + source, StringComparison.Ordinal);
        Assert.DoesNotContain(header + source, ch => ch == '\u001b');
        var directory = Directory.CreateTempSubdirectory("compassist-h-").FullName;
        try
        {
            File.WriteAllText(Path.Combine(directory, "h_ctrl.h"), header);
            File.WriteAllText(Path.Combine(directory, "h_ctrl.c"), source);
            File.WriteAllText(Path.Combine(directory, "main.c"), "#include \"h_ctrl.h\"\nint main(void)\n{\n    h_ctrl_state s;\n    h_ctrl_init(&s);\n    return (int)h_ctrl_step(&s, 0.0);\n}\n");
            CCompiler.Compile(directory, "-O0", "main.c h_ctrl.c");
        }
        finally
        {
            Directory.Delete(directory, recursive: true);
        }
    }

    [Fact]
    public void Generate_BadName_Throws()
    {
        Assert.Throws<ArgumentException>(() => CCodeGenerator.Generate("9lives", [], 0.01, "x"));
    }

    [Fact]
    public void Generate_HeaderStatesSampleTimeConventionAndCaution()
    {
        var (header, _) = CCodeGenerator.Generate("c1", [new Section(1, 0, 0, -0.5, 0)], 0.001, "test");
        Assert.Contains("Sample time: 0.001 s", header, StringComparison.Ordinal);
        Assert.Contains("transposed direct form II", header, StringComparison.Ordinal);
        Assert.Contains("not a safety function", header.Replace("\n * ", " ", StringComparison.Ordinal), StringComparison.Ordinal);
    }
}
