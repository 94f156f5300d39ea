using System.Numerics;
using CompAssist.Core.Editing;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Editing;

public class TargetMotionTests
{
    [Theory]
    [InlineData(0.37, 0.2)]
    [InlineData(1.0, 1.0)]
    [InlineData(4.99, 2.0)]
    [InlineData(5.0, 5.0)]
    [InlineData(73.0, 50.0)]
    public void RoundDown_AnyPositive_GivesOneTwoOrFiveTimesPowerOfTen(double x, double expected) =>
        Tolerance.Close(expected, TargetMotion.RoundDown(x), 1e-12);

    [Fact]
    public void Move_LeftInRealImaginaryMode_ChangesOnlyTheRealPartOntoTheGrid()
    {
        // |s| = 5: coarse step 0.5 (a tenth, rounded down to 1-2-5).
        var moved = TargetMotion.Move(new Complex(-3.0, 4.0), MoveDirection.Left, MotionMode.RealImaginary, StepSize.Coarse, 5.0);
        Tolerance.Close(-3.5, moved.Real, 1e-12);
        Tolerance.Close(4.0, moved.Imaginary, 1e-12);
    }

    [Fact]
    public void Move_FineStep_IsATenthOfTheCoarseStep()
    {
        var moved = TargetMotion.Move(new Complex(-3.0, 4.0), MoveDirection.Up, MotionMode.RealImaginary, StepSize.Fine, 5.0);
        Tolerance.Close(4.05, moved.Imaginary, 1e-12);
        Tolerance.Close(-3.0, moved.Real, 1e-12);
    }

    [Fact]
    public void Move_OffGridStart_LandsOnTheGrid()
    {
        var moved = TargetMotion.Move(new Complex(-3.3333333, 4.5), MoveDirection.Right, MotionMode.RealImaginary, StepSize.Coarse, 5.0);
        Tolerance.Close(-3.0, moved.Real, 1e-12);
    }

    [Fact]
    public void Move_DownAtTheRealAxis_StaysInTheUpperHalfPlane()
    {
        var moved = TargetMotion.Move(new Complex(-2.0, 0.1), MoveDirection.Down, MotionMode.RealImaginary, StepSize.Coarse, 5.0);
        Assert.Equal(0.0, moved.Imaginary);
    }

    [Fact]
    public void Move_LeftInDampingFrequencyMode_KeepsZetaAndRaisesNaturalFrequency()
    {
        // ζ = σ/ωn, ωn = |s| for s = −σ + jωd (common practice).
        var start = new Complex(-3.0, 4.0); // ζ = 0.6, ωn = 5
        var moved = TargetMotion.Move(start, MoveDirection.Left, MotionMode.DampingFrequency, StepSize.Coarse, 5.0);
        Tolerance.Close(5.5, moved.Magnitude, 1e-12);
        Tolerance.Close(0.6, -moved.Real / moved.Magnitude, 1e-12);
    }

    [Fact]
    public void Move_UpInDampingFrequencyMode_KeepsNaturalFrequencyAndLowersZeta()
    {
        var start = new Complex(-3.0, 4.0);
        var moved = TargetMotion.Move(start, MoveDirection.Up, MotionMode.DampingFrequency, StepSize.Coarse, 5.0);
        Tolerance.Close(5.0, moved.Magnitude, 1e-12);
        Tolerance.Close(0.55, -moved.Real / moved.Magnitude, 1e-12);
    }

    [Fact]
    public void Move_DownAtZetaOne_StaysOnTheRealAxis()
    {
        var moved = TargetMotion.Move(new Complex(-2.0, 0.0), MoveDirection.Down, MotionMode.DampingFrequency, StepSize.Coarse, 5.0);
        Tolerance.Close(-2.0, moved.Real, 1e-12);
        Assert.Equal(0.0, moved.Imaginary);
    }

    [Fact]
    public void Move_LeftThenRight_ReturnsToTheStart()
    {
        var start = new Complex(-2.5, 4.0);
        var there = TargetMotion.Move(start, MoveDirection.Right, MotionMode.RealImaginary, StepSize.Coarse, 5.0);
        var back = TargetMotion.Move(there, MoveDirection.Left, MotionMode.RealImaginary, StepSize.Coarse, 5.0);
        Tolerance.Close(start, back, 1e-12);
    }

    [Fact]
    public void Move_UpInDampingFrequencyModeInTheRightHalfPlane_StaysThere()
    {
        var moved = TargetMotion.Move(new Complex(1.0, 4.0), MoveDirection.Up, MotionMode.DampingFrequency, StepSize.Coarse, 5.0);
        Assert.True(moved.Real > 0, $"{moved}");
    }

    [Fact]
    public void Move_NonFiniteTarget_Throws() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => TargetMotion.Move(new Complex(double.NaN, 1), MoveDirection.Left, MotionMode.RealImaginary, StepSize.Coarse, 5.0));

    [Fact]
    public void Move_TenFineStepsRight_EqualOneCoarseStep()
    {
        var fine = new Complex(-3.0, 4.0);
        for (var i = 0; i < 10; i++)
        {
            fine = TargetMotion.Move(fine, MoveDirection.Right, MotionMode.RealImaginary, StepSize.Fine, 5.0);
        }

        var coarse = TargetMotion.Move(new Complex(-3.0, 4.0), MoveDirection.Right, MotionMode.RealImaginary, StepSize.Coarse, 5.0);
        Tolerance.Close(coarse.Real, fine.Real, 1e-12);
    }
}
