namespace CompAssist.Core.Common;

/// <summary>Angle conversions and wrapping.</summary>
public static class Angles
{
    /// <summary>Degrees to radians.</summary>
    public static double ToRadians(double degrees) => degrees * Math.PI / 180.0;

    /// <summary>Radians to degrees.</summary>
    public static double ToDegrees(double radians) => radians * 180.0 / Math.PI;

    /// <summary>Wraps an angle in degrees into (−180°, 180°].</summary>
    public static double WrapDegrees(double degrees)
    {
        var w = degrees % 360.0;
        if (w <= -180.0)
        {
            w += 360.0;
        }
        else if (w > 180.0)
        {
            w -= 360.0;
        }

        return w;
    }
}
