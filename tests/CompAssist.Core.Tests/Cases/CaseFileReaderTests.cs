using System.Numerics;
using CompAssist.Core.Cases;
using CompAssist.Core.Model;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Tests.Cases;

public class CaseFileReaderTests
{
    private const string Complete = """
        format = 1
        name = "test axis"
        description = "a test"

        [loop]
        plant = "4/(s(s+2))"
        feedback = "1"
        sign = "positive"
        pade_order = 4

        [requirements]
        overshoot_percent = 10
        settling_time = 2.5
        settling_band = 5
        peak_time = 1.2
        target = [-2.0, 3.5]

        [compensator]
        type = "lead"
        placement = "fixed-zero"
        zero = -3
        pole = -20.5
        ratio = 8
        max_stage_angle_deg = 55
        """;

    [Fact]
    public void Read_CompleteFile_MapsEveryKey()
    {
        var (c, error) = CaseFileReader.Read(Complete, "t.toml");
        Assert.Null(error);
        Assert.NotNull(c);
        Assert.Equal("test axis", c.Name);
        Assert.Equal("4/(s(s+2))", c.Plant);
        Assert.Equal(FeedbackSign.Positive, c.Sign);
        Assert.Equal(4, c.PadeOrder);
        Assert.Equal(10, c.Requirements.MaxOvershootPercent);
        Assert.Equal(2.5, c.Requirements.MaxSettlingTime);
        Assert.Equal(SettlingBand.FivePercent, c.Requirements.Band);
        Assert.Equal(1.2, c.Requirements.MaxPeakTime);
        Assert.Equal(new Complex(-2, 3.5), c.Requirements.Point);
        Assert.Equal(LeadPlacement.FixedZero, c.Lead.Placement);
        Assert.Equal(-3, c.Lead.Zero);
        Assert.Equal(-20.5, c.Lead.Pole);
        Assert.Equal(8, c.Lead.Ratio);
        Assert.Equal(55, c.Lead.MaxStageAngleDegrees);
    }

    public static TheoryData<string, string> BadFiles() => new()
    {
        { "name = \"x\"", "The case file has no 'format' key" },
        { "format = 2", "Case-file format 2 is not supported by this version (it reads format 1)" },
        { "format = \"1\"", "'format' must be a whole number" },
        { "format = 1\n[loop]\nplnat = \"1/s\"", "Unknown key 'plnat' in [loop]" },
        { "format = 1\ncolour = 3", "Unknown key 'colour' at the top level" },
        { "format = 1\n[loop]\nsign = \"sideways\"", "[loop] sign = \"sideways\" is not a feedback sign" },
        { "format = 1\n[loop]\nplant = 5", "[loop] plant must be a string" },
        { "format = 1\n[requirements]\nsettling_time = \"2\"", "[requirements] settling_time must be a number" },
        { "format = 1\n[requirements]\nsettling_band = 3", "[requirements] settling_band = 3 is not supported" },
        { "format = 1\n[requirements]\ntarget = [1]", "[requirements] target must be [re, im]" },
        { "format = 1\n[compensator]\nplacement = \"middle\"", "[compensator] placement = \"middle\" is not a placement" },
        { "format = 1\nloop = 3", "'loop' must be a table" },
        { "format = 1\n[requirements]\novershoot_percent = 5e-324", "[requirements] overshoot_percent is not a usable number (NaN, an infinity or below 1e-300 in magnitude)" },
        { "format = 1\n[requirements]\nkv = inf", "[requirements] kv is not a usable number (NaN, an infinity or below 1e-300 in magnitude)" },
        { "format = 1\n[requirements]\nkv = nan", "[requirements] kv is not a usable number (NaN, an infinity or below 1e-300 in magnitude)" },
        { "format = 1\n[check]\noutput_limits = [100, 0]", "[check] output_limits must be [low, high] with low < high" },
        { "format = 1\n[check]\noutput_limits = 100", "[check] output_limits must be [low, high] with low < high" },
        { "format = 1\n[check]\nactuator_limit = 5\noutput_limits = [0, 5]", "[check] gives both actuator_limit and output_limits" },
        { "format = 1\n[check]\noutput_limits = [0, 100]\noperating_point = -3", "[check] operating_point = -3 lies outside the output limits 0 … 100" },
    };

    [Fact]
    public void Read_OutputLimitsAndOperatingPoint_ReadAndWrittenBack()
    {
        var (c, error) = CaseFileReader.Read("format = 1\n[loop]\nplant = \"1/(s+1)\"\n[check]\noutput_limits = [0, 100.5]\noperating_point = 20\n", "heater.toml");
        Assert.Null(error);
        Assert.Equal(0.0, c!.Check.OutputLimits!.Low);
        Assert.Equal(100.5, c.Check.OutputLimits.High);
        Assert.Equal(-20.0, c.Check.CommandRoom!.Low);
        Assert.Equal(80.5, c.Check.CommandRoom.High);
        var (again, _) = CaseFileReader.Read(CaseFileWriter.Write(c), "again.toml");
        Assert.Equal(c.Check, again!.Check);
    }

    [Theory]
    [MemberData(nameof(BadFiles))]
    public void Read_BadFile_ReportsWhatAndHint(string text, string message)
    {
        var (c, error) = CaseFileReader.Read(text, "bad.toml");
        Assert.Null(c);
        Assert.NotNull(error);
        Assert.Equal(message, error.Message);
        Assert.False(string.IsNullOrWhiteSpace(error.Hint));
    }

    [Theory]
    [InlineData("format = 1\n[loop]\nplant = \"4/(s(s+2))\"\nplant = \"1/s\"\n", 4)]
    [InlineData("format = 1\n[loop]\nplant = \"4/(s(s+2))\"\n[loop]\nfeedback = \"1\"\n", 4)]
    public void Read_KeyOrTableGivenTwice_ErrorAtTheRepeat(string text, int line)
    {
        // TOML 1.0 (toml.io, "Keys" and "Table"): defining a key or a table more than once is invalid.
        var (c, error) = CaseFileReader.Read(text, "twice.toml");
        Assert.Null(c);
        Assert.NotNull(error);
        Assert.Equal(line, error.Line);
        Assert.Contains("already defined", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_ControlCharactersInTheName_ShownAsEscapesNeverPassedToATerminal()
    {
        var (c, error) = CaseFileReader.Read("format = 1\nname = \"axis \\u001b[31mred\"\ndescription = \"bell \\u0007\"\n", "hostile.toml");
        Assert.Null(error);
        Assert.Equal("axis \\u001B[31mred", c!.Name);
        Assert.Equal("bell \\u0007", c.Description);
        Assert.DoesNotContain(c.Name + c.Description, char.IsControl);
    }

    [Fact]
    public void Read_SyntaxError_HasLineAndColumn()
    {
        var (_, error) = CaseFileReader.Read("format = 1\n[loop\nplant = \"1/s\"", "broken.toml");
        Assert.NotNull(error);
        Assert.Equal(2, error.Line);
        Assert.NotNull(error.Column);
        Assert.StartsWith("broken.toml(2,", error.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void ReadFile_Missing_ReportsPath()
    {
        var (_, error) = CaseFileReader.ReadFile("/nonexistent/case.toml");
        Assert.NotNull(error);
        Assert.StartsWith("Cannot read the case file", error.Message, StringComparison.Ordinal);
    }
}
