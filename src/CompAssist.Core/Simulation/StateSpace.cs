namespace CompAssist.Core.Simulation;

/// <summary>
/// A single-input single-output continuous-time realization ẋ = A x + B u, y = C x + D u.
/// Arrays are copied on creation and never exposed for writing.
/// </summary>
public sealed class StateSpace
{
    private readonly double[,] _a;
    private readonly double[] _b;
    private readonly double[] _c;

    private StateSpace(double[,] a, double[] b, double[] c, double d)
    {
        _a = a;
        _b = b;
        _c = c;
        D = d;
    }

    /// <summary>Number of states.</summary>
    public int Order => _b.Length;

    /// <summary>Direct feedthrough D.</summary>
    public double D { get; }

    /// <summary>Element of A.</summary>
    public double A(int row, int column) => _a[row, column];

    /// <summary>Element of B.</summary>
    public double B(int row) => _b[row];

    /// <summary>Element of C.</summary>
    public double C(int column) => _c[column];

    /// <summary>Creates a realization (the arrays are copied).</summary>
    /// <exception cref="ArgumentException">Dimensions disagree.</exception>
    public static StateSpace Create(double[,] a, double[] b, double[] c, double d)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        ArgumentNullException.ThrowIfNull(c);
        var n = b.Length;
        if (a.GetLength(0) != n || a.GetLength(1) != n || c.Length != n)
        {
            throw new ArgumentException("A must be n×n with B and C of length n.");
        }

        return new StateSpace((double[,])a.Clone(), (double[])b.Clone(), (double[])c.Clone(), d);
    }

    /// <summary>The series connection: this system's output drives <paramref name="next"/>.</summary>
    public StateSpace Then(StateSpace next)
    {
        ArgumentNullException.ThrowIfNull(next);
        int n1 = Order, n2 = next.Order, n = n1 + n2;
        var a = new double[n, n];
        var b = new double[n];
        var c = new double[n];
        for (var i = 0; i < n1; i++)
        {
            for (var j = 0; j < n1; j++)
            {
                a[i, j] = _a[i, j];
            }

            b[i] = _b[i];
            c[i] = next.D * _c[i];
        }

        for (var i = 0; i < n2; i++)
        {
            for (var j = 0; j < n2; j++)
            {
                a[n1 + i, n1 + j] = next._a[i, j];
            }

            for (var j = 0; j < n1; j++)
            {
                a[n1 + i, j] = next._b[i] * _c[j];
            }

            b[n1 + i] = next._b[i] * D;
            c[n1 + i] = next._c[i];
        }

        return new StateSpace(a, b, c, next.D * D);
    }

    internal double[,] CopyA() => (double[,])_a.Clone();

    internal double[] CopyB() => (double[])_b.Clone();

    internal double[] CopyC() => (double[])_c.Clone();
}
