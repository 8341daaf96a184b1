namespace VolCast.Core.Numerics;

/// <summary>Small dense symmetric positive-definite matrix routines (row-major, k × k with k a handful).</summary>
internal static class SymmetricMatrix
{
    /// <summary>Inverts a symmetric positive-definite matrix through its Cholesky factor.</summary>
    /// <param name="matrix">The matrix, row-major k × k; left unchanged.</param>
    /// <param name="size">k.</param>
    /// <param name="inverse">Receives the inverse, row-major k × k.</param>
    /// <returns>False when the matrix is not numerically positive definite.</returns>
    public static bool TryInvert(ReadOnlySpan<double> matrix, int size, Span<double> inverse)
        => TryInvertCore(matrix, size, inverse);

    /// <summary>Inverts a symmetric positive-definite matrix held as a two-dimensional array.</summary>
    /// <param name="matrix">The matrix, k × k; left unchanged.</param>
    /// <returns>The inverse, or null when the matrix is not numerically positive definite or not finite.</returns>
    public static double[,]? TryInvert(double[,] matrix)
    {
        var size = matrix.GetLength(0);
        var flat = new double[size * size];
        for (var i = 0; i < size; i++)
        {
            for (var j = 0; j < size; j++)
            {
                if (!double.IsFinite(matrix[i, j]))
                {
                    return null;
                }

                flat[(i * size) + j] = matrix[i, j];
            }
        }

        var inverse = new double[size * size];
        if (!TryInvertCore(flat, size, inverse))
        {
            return null;
        }

        var result = new double[size, size];
        for (var i = 0; i < size; i++)
        {
            for (var j = 0; j < size; j++)
            {
                result[i, j] = inverse[(i * size) + j];
            }
        }

        return result;
    }

    private static bool TryInvertCore(ReadOnlySpan<double> matrix, int size, Span<double> inverse)
    {
        var l = new double[size * size];
        var scale = 0.0;
        for (var i = 0; i < size; i++)
        {
            scale = Math.Max(scale, Math.Abs(matrix[(i * size) + i]));
        }

        for (var i = 0; i < size; i++)
        {
            for (var j = 0; j <= i; j++)
            {
                var sum = matrix[(i * size) + j];
                for (var p = 0; p < j; p++)
                {
                    sum -= l[(i * size) + p] * l[(j * size) + p];
                }

                if (i == j)
                {
                    // A pivot lost to rounding relative to the largest diagonal means a singular matrix.
                    if (!(sum > scale * 1e-14))
                    {
                        return false;
                    }

                    l[(i * size) + i] = Math.Sqrt(sum);
                }
                else
                {
                    l[(i * size) + j] = sum / l[(j * size) + j];
                }
            }
        }

        // inverse = L^-T L^-1, column by column: solve L y = e_c, then L^T x = y.
        var y = new double[size];
        for (var c = 0; c < size; c++)
        {
            for (var i = 0; i < size; i++)
            {
                var sum = i == c ? 1.0 : 0.0;
                for (var p = 0; p < i; p++)
                {
                    sum -= l[(i * size) + p] * y[p];
                }

                y[i] = sum / l[(i * size) + i];
            }

            for (var i = size - 1; i >= 0; i--)
            {
                var sum = y[i];
                for (var p = i + 1; p < size; p++)
                {
                    sum -= l[(p * size) + i] * inverse[(p * size) + c];
                }

                inverse[(i * size) + c] = sum / l[(i * size) + i];
            }
        }

        return true;
    }

    /// <summary>Computes the quadratic form v′ A⁻¹ v for a symmetric positive-definite A.</summary>
    /// <returns>The form, or null when A is not numerically positive definite.</returns>
    public static double? InverseQuadraticForm(ReadOnlySpan<double> matrix, int size, ReadOnlySpan<double> vector)
    {
        var inverse = new double[size * size];
        if (!TryInvert(matrix, size, inverse))
        {
            return null;
        }

        var q = 0.0;
        for (var i = 0; i < size; i++)
        {
            for (var j = 0; j < size; j++)
            {
                q += vector[i] * inverse[(i * size) + j] * vector[j];
            }
        }

        return q;
    }
}
