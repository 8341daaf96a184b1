namespace VolCast.Core.Garch;

/// <summary>Inverts a small symmetric positive definite matrix by Cholesky factorization.</summary>
internal static class SymmetricInverse
{
    /// <summary>Returns the inverse of <paramref name="a"/> (k × k, symmetric), or null when it is not positive definite or not finite.</summary>
    public static double[,]? TryInvert(double[,] a)
    {
        var k = a.GetLength(0);
        var l = new double[k, k];
        for (var i = 0; i < k; i++)
        {
            for (var j = 0; j <= i; j++)
            {
                var sum = a[i, j];
                for (var m = 0; m < j; m++)
                {
                    sum -= l[i, m] * l[j, m];
                }

                if (i == j)
                {
                    if (!(sum > 0) || !double.IsFinite(sum))
                    {
                        return null;
                    }

                    l[i, i] = Math.Sqrt(sum);
                }
                else
                {
                    l[i, j] = sum / l[j, j];
                }
            }
        }

        // Columns of the inverse solve L Lᵀ x = e_c.
        var inverse = new double[k, k];
        var z = new double[k];
        for (var c = 0; c < k; c++)
        {
            for (var i = 0; i < k; i++)
            {
                var sum = i == c ? 1.0 : 0.0;
                for (var m = 0; m < i; m++)
                {
                    sum -= l[i, m] * z[m];
                }

                z[i] = sum / l[i, i];
            }

            for (var i = k - 1; i >= 0; i--)
            {
                var sum = z[i];
                for (var m = i + 1; m < k; m++)
                {
                    sum -= l[m, i] * inverse[m, c];
                }

                inverse[i, c] = sum / l[i, i];
            }
        }

        return inverse;
    }
}
