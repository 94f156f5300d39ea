using System.Text.RegularExpressions;
using CompAssist.Cli.Tests.Support;

namespace CompAssist.Cli.Tests;

/// <summary>
/// The exit-code scheme for a command line the parser cannot take: 1 for usage (missing value, unknown option
/// or command), 2 for a value that is not a number; with either, nothing on stdout and our own words on
/// stderr (no help text, no .NET type names).
/// </summary>
public partial class UsageErrorsTests
{
    private static string[] BaseArguments(string command, string folder) => command switch
    {
        "design" => ["--plant", "4/(s(s+2))", "--overshoot", "20", "--settling", "2", "--corner"],
        "check" or "locus" => ["--plant", "4/(s(s+2))", "--compensator", "4(s+2)/(s+4)"],
        "plot" => ["--plant", "4/(s(s+2))", "--compensator", "4(s+2)/(s+4)", "--out", Path.Combine(folder, "p.svg")],
        "discretize" => ["--compensator", "4(s+2)/(s+4)", "--sample-time", "0.01"],
        _ => ["--plant", "4/(s(s+2))", "--overshoot", "20", "--settling", "2", "--corner", "--out", Path.Combine(folder, "pkg")],
    };

    [GeneratedRegex(@"^\s+(--[a-z-]+) <", RegexOptions.Multiline)]
    private static partial Regex ValuedFlag();

    [Theory]
    [InlineData("2,5", "decimal point")]
    [InlineData("abc", "is not a number")]
    [InlineData("inf", "is not a number")]
    [InlineData("1.5.2", "is not a number")]
    public void Run_NumericFlagWithAnUnusableNumber_InputErrorNamingTheFlag(string value, string expected)
    {
        foreach (var flag in new[] { "--overshoot", "--settling", "--zeta", "--kv", "--min-phase-margin", "--ratio", "--actuator-limit" })
        {
            var (code, output, error) = CliRunner.Run("design", "--plant", "4/(s(s+2))", flag, value);
            Assert.True(code == 2, $"{flag} {value}: exit {code}, {error}");
            Assert.Equal(string.Empty, output);
            Assert.Contains($"{flag} '{value}'", error, StringComparison.Ordinal);
            Assert.Contains(expected, error, StringComparison.Ordinal);
        }
    }

    [Theory]
    [InlineData("2.5")]
    [InlineData("1,0")]
    [InlineData("x")]
    public void Run_WholeNumberFlagWithAnotherValue_InputError(string value)
    {
        var (code, output, error) = CliRunner.Run("design", "--plant", "4/(s(s+2))", "--overshoot", "10", "--settling", "2", "--pade-order", value);
        Assert.Equal(2, code);
        Assert.Equal(string.Empty, output);
        Assert.Contains("not a whole number", error, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("design", "--plant")]
    [InlineData("bogus")]
    [InlineData("design", "--plant", "1/s", "--bogus", "3")]
    [InlineData("check", "--plant", "1/s", "--bogus")]
    public void Run_UsageError_ExitOneAndNothingOnStdout(params string[] args)
    {
        var (code, output, error) = CliRunner.Run(args);
        Assert.Equal(1, code);
        Assert.Equal(string.Empty, output);
        Assert.StartsWith("error: ", error, StringComparison.Ordinal);
        Assert.DoesNotContain("System.", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_EveryValuedFlagOfEveryCommandWithHostileValues_NoInternalErrorNoTypeNameNoStrayOutput()
    {
        // Fuzz by the grammar of the command line itself: every flag each command's help lists, with values a
        // hurried user or a script types. Whatever the flag, the answer follows the exit-code scheme.
        var values = new[] { "2,5", "", "nan", "-", "1e400", "--json", "0x10", "١٢", "1e308", "-1e308", "1e-320", "Infinity", "0", "-0" };
        var tried = 0;
        var folder = Directory.CreateTempSubdirectory("ca-usage-").FullName;
        var valid = 0;
        foreach (var command in new[] { "design", "check", "locus", "plot", "discretize", "handoff" })
        {
            var (baseCode, _, baseError) = CliRunner.Run([command, .. BaseArguments(command, folder)]);
            Assert.True(baseCode is 0 or 4, $"{command} base command line: exit {baseCode}, {baseError}");
            var (_, help, _) = CliRunner.Run(command, "--help");
            foreach (var flag in ValuedFlag().Matches(help).Select(m => m.Groups[1].Value).Distinct())
            {
                foreach (var value in values)
                {
                    var (code, output, error) = CliRunner.Run([command, .. BaseArguments(command, folder), flag, value]);
                    var what = $"{command} {flag} '{value}': exit {code}, stderr {error}";
                    Assert.True(code is 1 or 2 or 3 or 0 or 4, what);
                    Assert.DoesNotContain("System.", error, StringComparison.Ordinal);
                    Assert.DoesNotContain("internal error", error, StringComparison.Ordinal);
                    if (code is 1 or 2 or 3)
                    {
                        Assert.True(output.Length == 0, what + " printed on stdout");
                    }

                    tried++;
                    valid += code is 0 or 4 ? 1 : 0;
                }
            }
        }

        Directory.Delete(folder, true);
        Assert.True(tried > 300, $"only {tried} command lines tried");
        Assert.True(valid < tried, "every hostile value was taken");
    }
}
