using CompAssist.Core.Numerics;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Numerics;

public class BisectionTests
{
    [Fact]
    public void Root_CosineOnZeroToTwo_FindsHalfPi()
    {
        // cos has its first zero at π/2 (common practice).
        Tolerance.Close(Math.PI / 2, Bisection.Root(Math.Cos, 0, 2, 1.0, m => 1e-15 * m), 1e-14);
    }

    [Fact]
    public void Root_ExactZeroAtTheMidpoint_ReturnsItAtOnce()
    {
        var calls = 0;
        var root = Bisection.Root(x => { calls++; return x - 1; }, 0, 2, -1.0, _ => 0.0);
        Assert.Equal(1.0, root);
        Assert.Equal(1, calls);
    }

    [Fact]
    public void Root_StepLimit_StopsThere()
    {
        var calls = 0;
        Bisection.Root(x => { calls++; return x - Math.PI; }, 0, 4, -Math.PI, _ => 0.0, maxSteps: 10);
        Assert.Equal(10, calls);
    }
}
