namespace CompAssist.Core.Discrete;

/// <summary>Ways to turn a continuous compensator into a sampled one (common practice; Franklin, Powell and
/// Workman, Digital Control of Dynamic Systems, 3rd ed., chapter 6).</summary>
public enum DiscretizationMethod
{
    /// <summary>Bilinear s = (2/T)(z − 1)/(z + 1).</summary>
    Tustin,

    /// <summary>Bilinear with pre-warping: s = (ω₀/tan(ω₀T/2))(z − 1)/(z + 1), exact in frequency at ω₀.</summary>
    Prewarp,

    /// <summary>Matched pole–zero: z = e^{sT} for every pole and zero, zeros at infinity to z = −1, gain matched.</summary>
    Matched,

    /// <summary>Zero-order-hold equivalent: exact for piecewise-constant inputs.</summary>
    Zoh,

    /// <summary>Backward Euler s = (z − 1)/(zT).</summary>
    Backward,

    /// <summary>Forward Euler s = (z − 1)/T (can turn stable poles unstable; warned).</summary>
    Forward,
}
