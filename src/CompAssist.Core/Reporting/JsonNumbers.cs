using System.Text.Json;

namespace CompAssist.Core.Reporting;

/// <summary>JSON numbers for the machine interface: infinities and NaN become the strings "inf", "-inf", "nan".</summary>
public static class JsonNumbers
{
    /// <summary>Writes a named number.</summary>
    public static void Write(Utf8JsonWriter w, string name, double x)
    {
        ArgumentNullException.ThrowIfNull(w);
        if (double.IsFinite(x))
        {
            w.WriteNumber(name, x);
        }
        else
        {
            w.WriteString(name, double.IsNaN(x) ? "nan" : (x > 0 ? "inf" : "-inf"));
        }
    }
}
