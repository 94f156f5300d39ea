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

    /// <summary>Writes a named array of numbers.</summary>
    public static void WriteArray(Utf8JsonWriter w, string name, IEnumerable<double> values)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(values);
        w.WriteStartArray(name);
        foreach (var v in values)
        {
            w.WriteNumberValue(v);
        }

        w.WriteEndArray();
    }

    /// <summary>Writes a named array of complex numbers as {re, im} objects.</summary>
    public static void WriteComplexArray(Utf8JsonWriter w, string name, IEnumerable<System.Numerics.Complex> values)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(values);
        w.WriteStartArray(name);
        foreach (var z in values)
        {
            w.WriteStartObject();
            w.WriteNumber("re", z.Real);
            w.WriteNumber("im", z.Imaginary);
            w.WriteEndObject();
        }

        w.WriteEndArray();
    }
}
