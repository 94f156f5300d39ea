using System.Globalization;
using CompAssist.Core.Discrete;
using CompAssist.Core.Export;
using CompAssist.Core.Parsing;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Export;

public class FixedPointCodeGeneratorTests
{
    [Theory]
    [InlineData("4.7(s+2.93)/(s+5.46)", 0.01, 16, 8)]
    [InlineData("50(s^2+2s+26)/((s+1)(s+20)(s^2+8s+100))", 0.005, 24, 12)]
    [InlineData("20(s+0.5)(s+3)/((s+0.05)(s+30))", 0.002, 12, 6)]
    public void Generate_IsBitExactWithTheModelIncludingSaturation(string compensator, double t, int word, int signalBits)
    {
        var d = Discretizer.Discretize(ExpressionParser.Parse(compensator, false).Value!, t, DiscretizationMethod.Tustin).Value!.Discrete;
        var q = Quantizer.Quantize(d, SectionSplitter.Split(d), NumberFormat.Fixed(word));
        var cascade = FixedPointCascade.Create(q.Sections, word, signalBits);

        // Impulse, step, random and a saturating run (inputs near full scale).
        var random = new Random(5);
        var max = (1L << (word - 1)) - 1;
        var input = new List<long> { cascade.ToInteger(1.0) };
        input.AddRange(Enumerable.Repeat(0L, 49));
        input.AddRange(Enumerable.Repeat(cascade.ToInteger(0.5), 100));
        input.AddRange(Enumerable.Range(0, 100).Select(_ => cascade.ToInteger((random.NextDouble() - 0.5) * 0.5)));
        input.AddRange(Enumerable.Repeat(max, 50));
        input.AddRange(Enumerable.Repeat(-max - 1, 50));
        var expected = cascade.Run(input);
        if (Math.Abs(d.DcGain) > 1.5)
        {
            Assert.Contains(expected, v => v == max || v == -max - 1);
        }

        var (header, source) = FixedPointCodeGenerator.Generate("q_ctrl", cascade, t, "test");
        var values = string.Join(",\n", input.Select(v => v.ToString(CultureInfo.InvariantCulture)));
        var main = "#include <stdio.h>\n#include \"q_ctrl.h\"\nstatic const int32_t input[] = {\n" + values + "\n};\nint main(void)\n{\n    q_ctrl_state s;\n    unsigned i;\n    q_ctrl_init(&s);\n    for (i = 0; i < sizeof input / sizeof input[0]; ++i) {\n        printf(\"%ld\\n\", (long)q_ctrl_step(&s, input[i]));\n    }\n    return 0;\n}\n";
        var outputs = CCompiler.BuildAndRun(new Dictionary<string, string> { ["q_ctrl.h"] = header, ["q_ctrl.c"] = source, ["main.c"] = main })
            .Select(v => long.Parse(v, CultureInfo.InvariantCulture)).ToArray();
        Assert.Equal(expected, outputs);
    }

    [Fact]
    public void ShiftRound_RoundsHalvesAwayFromZero()
    {
        Assert.Equal(2, FixedPointCascade.ShiftRound(3, 1));
        Assert.Equal(-2, FixedPointCascade.ShiftRound(-3, 1));
        Assert.Equal(1, FixedPointCascade.ShiftRound(5, 2));
        Assert.Equal(-1, FixedPointCascade.ShiftRound(-5, 2));
    }

    [Fact]
    public void Create_WordTooLong_Throws()
    {
        Assert.Throws<ArgumentException>(() => FixedPointCascade.Create([], 32, 16));
    }
}
