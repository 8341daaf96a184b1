namespace VolCast.Core.Numerics;

/// <summary>
/// Ordinary least squares by Householder QR (Golub and Van Loan, Matrix Computations, 4th ed., §5.2 and §5.3) for a
/// tall design with a handful of columns, into buffers the caller keeps between fits, so that a walk-forward refit
/// allocates nothing.
/// </summary>
/// <remarks>
/// The arithmetic is the one Math.NET Numerics' managed provider does for <c>Matrix.QR().Solve(y)</c>, step for step
/// and in the same order: each reflector v is the column scaled to unit length with the sign of its first entry, plus
/// one in the first entry, times √(1/v₀); the reflections are applied column by column (dot product then update,
/// rows in ascending order); the thin Q is formed from the identity by the reflections in reverse; Qᵀy is a dot
/// product over the rows; R x = Qᵀy is solved by back substitution. The same sums in the same order give the same
/// bits, which a test checks against Math.NET on random and ill-conditioned designs.
/// </remarks>
internal sealed class HouseholderLeastSquares
{
    private readonly int _columns;
    private readonly double[] _a;
    private readonly double[] _work;
    private readonly double[] _q;
    private readonly double[] _solution;

    /// <summary>Creates the buffers for designs of up to <paramref name="maxRows"/> rows and <paramref name="columns"/> columns.</summary>
    /// <param name="maxRows">The most rows a design will have, at least <paramref name="columns"/>.</param>
    /// <param name="columns">k, the columns of every design, at least 1.</param>
    public HouseholderLeastSquares(int maxRows, int columns)
    {
        Preconditions.AtLeast(columns, 1, "columns");
        Preconditions.AtLeast(maxRows, columns, "rows", nameof(maxRows));
        MaxRows = maxRows;
        _columns = columns;
        _a = new double[maxRows * columns];
        _work = new double[maxRows * columns];
        _q = new double[maxRows * columns];
        _solution = new double[columns];
    }

    /// <summary>Gets the most rows a design may have.</summary>
    public int MaxRows { get; }

    /// <summary>
    /// Gets the design, column-major: entry (row i, column j) of an m-row design is at <c>j · m + i</c>. Fill the first
    /// m · k entries before <see cref="Solve"/>, which overwrites them.
    /// </summary>
    public Span<double> Design(int rows) => _a.AsSpan(0, Rows(rows) * _columns);

    /// <summary>Solves min ‖X b − y‖ for the design just filled in <see cref="Design"/>.</summary>
    /// <param name="rows">m, the rows of the design, between k and <see cref="MaxRows"/>.</param>
    /// <param name="y">The response, m values.</param>
    /// <param name="coefficients">Receives b, k values (not finite when the design is singular).</param>
    public void Solve(int rows, ReadOnlySpan<double> y, Span<double> coefficients)
    {
        var m = Rows(rows);
        var k = _columns;
        if (y.Length != m || coefficients.Length != k)
        {
            throw new ArgumentException($"The response must have {m} values (had {y.Length}) and the coefficients room for {k} (had {coefficients.Length}).");
        }

        var a = _a;
        var work = _work;
        for (var i = 0; i < k; i++)
        {
            Reflector(a, work, m, i);
            for (var j = i + 1; j < k; j++)
            {
                Reflect(work, i, a, j, m);
            }
        }

        // The thin Q: the first k columns of the identity, reflected in reverse order.
        var q = _q.AsSpan(0, m * k);
        q.Clear();
        for (var j = 0; j < k; j++)
        {
            q[(j * m) + j] = 1.0;
        }

        for (var i = k - 1; i >= 0; i--)
        {
            for (var j = i; j < k; j++)
            {
                Reflect(work, i, _q, j, m);
            }
        }

        var x = _solution;
        for (var i = 0; i < k; i++)
        {
            var column = _q.AsSpan(i * m, m);
            var sum = 0.0;
            for (var r = 0; r < m; r++)
            {
                sum += column[r] * y[r];
            }

            x[i] = sum;
        }

        // R x = Qᵀy, R in the top k rows of the reflected design.
        for (var c = k - 1; c >= 0; c--)
        {
            x[c] /= a[(c * m) + c];
            for (var i = 0; i < c; i++)
            {
                x[i] -= x[c] * a[(c * m) + i];
            }
        }

        x.AsSpan().CopyTo(coefficients);
    }

    private int Rows(int rows)
    {
        if (rows < _columns || rows > MaxRows)
        {
            throw new ArgumentOutOfRangeException(nameof(rows), rows, $"A design must have between {_columns} and {MaxRows} rows.");
        }

        return rows;
    }

    /// <summary>Moves rows i.. of column i into reflector i (held in work column i from its start) and leaves −‖x‖·sign(x₀) on the diagonal.</summary>
    private static void Reflector(double[] a, double[] work, int m, int i)
    {
        var column = i * m;
        for (var r = i; r < m; r++)
        {
            work[column + r - i] = a[column + r];
            a[column + r] = 0.0;
        }

        var length = m - i;
        var norm = 0.0;
        for (var r = 0; r < length; r++)
        {
            norm += work[column + r] * work[column + r];
        }

        norm = Math.Sqrt(norm);
        if (i == m - 1 || norm == 0)
        {
            a[column + i] = -work[column];
            work[column] = Math.Sqrt(2.0);
            return;
        }

        var scale = 1.0 / norm;
        if (work[column] < 0.0)
        {
            scale *= -1.0;
        }

        a[column + i] = -1.0 / scale;
        for (var r = 0; r < length; r++)
        {
            work[column + r] *= scale;
        }

        work[column] += 1.0;
        var s = Math.Sqrt(1.0 / work[column]);
        for (var r = 0; r < length; r++)
        {
            work[column + r] *= s;
        }
    }

    /// <summary>Applies reflector i (I − v vᵀ on rows i..) to column j of the column-major matrix <paramref name="target"/>.</summary>
    private static void Reflect(double[] work, int i, double[] target, int j, int m)
    {
        var v = work.AsSpan(i * m, m - i);
        var x = target.AsSpan((j * m) + i, m - i);
        var dot = 0.0;
        for (var r = 0; r < v.Length; r++)
        {
            dot += v[r] * x[r];
        }

        for (var r = 0; r < v.Length; r++)
        {
            x[r] -= v[r] * dot;
        }
    }
}
