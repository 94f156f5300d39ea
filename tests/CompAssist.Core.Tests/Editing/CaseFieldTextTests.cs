using CompAssist.Core.Cases;
using CompAssist.Core.Editing;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Tests.Editing;

public class CaseFieldTextTests
{
    private static CaseFile Demo()
    {
        var (c, error) = CaseFileReader.ReadFile(Path.Combine(Support.Repository.Root(), "cases", "belt-axis.toml"));
        Assert.Null(error);
        return c!;
    }

    [Fact]
    public void Of_EveryField_ReadsBackThroughApplyUnchanged()
    {
        var c = Demo();
        foreach (var field in Enum.GetValues<CaseField>())
        {
            var edit = CaseFieldText.Apply(c, field, CaseFieldText.Of(c, field));
            Assert.True(edit.IsSuccess, $"{field}: {edit.Error?.Message}");
            Assert.Equal(CaseFileWriter.Write(c), CaseFileWriter.Write(edit.Case));
        }
    }

    [Theory]
    [InlineData(CaseField.MinPhaseMargin, "45")]
    [InlineData(CaseField.MinGainMargin, "6")]
    [InlineData(CaseField.MinDelayMargin, "0.05")]
    [InlineData(CaseField.MaxSensitivity, "2")]
    [InlineData(CaseField.RiseTime, "0.4")]
    public void Apply_MarginAndRiseRequirements_SetTheRequirementAndClearWhenEmpty(CaseField field, string text)
    {
        var edit = CaseFieldText.Apply(Demo(), field, text);
        Assert.True(edit.IsSuccess, edit.Error?.Message);
        Assert.Equal(text, CaseFieldText.Of(edit.Case!, field));
        var cleared = CaseFieldText.Apply(edit.Case!, field, string.Empty);
        Assert.True(cleared.IsSuccess);
        Assert.Equal(string.Empty, CaseFieldText.Of(cleared.Case!, field));
    }

    [Fact]
    public void Apply_ActuatorLimitField_OneNumberIsALimitOnMagnitudeAPairIsOutputLimits()
    {
        var c = new CaseFile { Plant = "1/(s+1)" };
        var pair = CaseFieldText.Apply(c, CaseField.ActuatorLimit, "0, 100");
        Assert.True(pair.IsSuccess);
        Assert.Equal(CommandRange.Create(0, 100), pair.Case.Check.OutputLimits);
        Assert.Null(pair.Case.Check.ActuatorLimit);
        Assert.Equal("0,100", CaseFieldText.Of(pair.Case, CaseField.ActuatorLimit));
        var single = CaseFieldText.Apply(pair.Case, CaseField.ActuatorLimit, "12");
        Assert.Equal(12.0, single.Case!.Check.ActuatorLimit);
        Assert.Null(single.Case.Check.OutputLimits);
        var bad = CaseFieldText.Apply(c, CaseField.ActuatorLimit, "0,1x0");
        Assert.False(bad.IsSuccess);
        Assert.Equal(3, bad.Error.Index);
        Assert.False(CaseFieldText.Apply(c, CaseField.ActuatorLimit, "5,1").IsSuccess);
        Assert.False(CaseFieldText.Apply(c with { Check = c.Check with { OperatingPoint = 50 } }, CaseField.ActuatorLimit, "0,10").IsSuccess);
    }

    [Fact]
    public void Apply_BadPlant_PointsAtTheOffendingCharacter()
    {
        var edit = CaseFieldText.Apply(Demo(), CaseField.Plant, "25/(s(s+5)");
        Assert.False(edit.IsSuccess);
        Assert.Equal("25/(s(s+5)", edit.Error.Input);
        Assert.InRange(edit.Error.Index, 3, 10);
    }

    [Fact]
    public void Apply_NumberWithALetter_PointsAtTheLetter()
    {
        var edit = CaseFieldText.Apply(Demo(), CaseField.SettlingTime, "1.2x");
        Assert.False(edit.IsSuccess);
        Assert.Equal(3, edit.Error.Index);
        Assert.Equal(1, edit.Error.Length);
    }

    [Theory]
    [InlineData(CaseField.Overshoot, "100")]
    [InlineData(CaseField.Overshoot, "-5")]
    [InlineData(CaseField.Zeta, "1.5")]
    [InlineData(CaseField.Zeta, "1")]
    [InlineData(CaseField.MinPhaseMargin, "200")]
    [InlineData(CaseField.MinGainMargin, "-3")]
    [InlineData(CaseField.MinDelayMargin, "0")]
    [InlineData(CaseField.MaxSensitivity, "0.8")]
    [InlineData(CaseField.RiseTime, "-1")]
    [InlineData(CaseField.SettlingTime, "0")]
    [InlineData(CaseField.Band, "3")]
    [InlineData(CaseField.PadeOrder, "11")]
    [InlineData(CaseField.Sign, "x")]
    [InlineData(CaseField.ErrorConstant, "kq=3")]
    [InlineData(CaseField.ErrorConstant, "step_error=1.5")]
    [InlineData(CaseField.Variations, "gain=20%, wobble=3%")]
    public void Apply_OutOfRange_IsRejectedWithAPositionedError(CaseField field, string text)
    {
        var edit = CaseFieldText.Apply(Demo(), field, text);
        Assert.False(edit.IsSuccess);
        Assert.InRange(edit.Error.Index, 0, text.Length);
        Assert.True(edit.Error.Length >= 1);
        Assert.False(string.IsNullOrWhiteSpace(edit.Error.Hint));
    }

    [Fact]
    public void Apply_SecondBadVariation_PointsAtTheSecondItem()
    {
        var edit = CaseFieldText.Apply(Demo(), CaseField.Variations, "gain=20%, wobble=3%");
        Assert.Equal(10, edit.Error!.Index);
        Assert.Equal("wobble=3%".Length, edit.Error.Length);
    }

    [Fact]
    public void Apply_EmptyOptionalNumber_ClearsIt()
    {
        var edit = CaseFieldText.Apply(Demo(), CaseField.Overshoot, "  ");
        Assert.True(edit.IsSuccess);
        Assert.Null(edit.Case.Requirements.MaxOvershootPercent);
    }

    [Fact]
    public void Apply_RampError_BecomesTheVelocityConstant()
    {
        // Unit-ramp error = 1/Kv (common practice).
        var edit = CaseFieldText.Apply(Demo(), CaseField.ErrorConstant, "ramp_error=0.05");
        Assert.True(edit.IsSuccess);
        Assert.Equal(ErrorConstantKind.Velocity, edit.Case.Requirements.Constant!.Kind);
        Support.Tolerance.Close(20.0, edit.Case.Requirements.Constant.Value, 1e-12);
    }

    [Fact]
    public void Apply_PositiveSign_FlipsTheFeedback() =>
        Assert.Equal(FeedbackSign.Positive, CaseFieldText.Apply(Demo(), CaseField.Sign, "+").Case!.Sign);

    [Fact]
    public void Apply_PlacementValueForRatio_SetsTheRatio()
    {
        var c = Demo() with { Lead = new LeadOptions { Placement = LeadPlacement.Ratio } };
        var edit = CaseFieldText.Apply(c, CaseField.PlacementValue, "8");
        Assert.Equal(8.0, edit.Case!.Lead.Ratio);
    }

    [Fact]
    public void Apply_PlacementValueForBisector_RefusesANumber() =>
        Assert.False(CaseFieldText.Apply(Demo(), CaseField.PlacementValue, "3").IsSuccess);
}
