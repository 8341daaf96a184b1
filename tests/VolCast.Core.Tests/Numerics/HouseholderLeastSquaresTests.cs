using MathNet.Numerics.LinearAlgebra;
using VolCast.Core.Numerics;

namespace VolCast.Core.Tests.Numerics;

public sealed class HouseholderLeastSquaresTests
{
    [Theory]
    // A well-conditioned design, a HAR-like one whose columns are nearly collinear, and the smallest (square) case.
    [InlineData(2520, 4, 1.0, 7)]
    [InlineData(300, 4, 1e-6, 8)]
    [InlineData(4, 4, 1.0, 9)]
    [InlineData(50, 1, 1.0, 10)]
    public void Solve_MatchesMathNetQrSolveBitForBit(int rows, int columns, double spread, int seed)
    {
        // Reference: Math.NET Numerics' Matrix.QR().Solve, which the walk-forward HAR refit used before; the same
        // Householder steps in the same order must give the same bits (a forecast file must not change).
        var random = new Random(seed);
        var common = new double[rows];
        for (var i = 0; i < rows; i++)
        {
            common[i] = random.NextDouble();
        }

        var x = Matrix<double>.Build.Dense(rows, columns, (i, j) => j == 0 ? 1.0 : common[i] + (spread * random.NextDouble()));
        var y = Vector<double>.Build.Dense(rows, i => common[i] + (0.1 * random.NextDouble()));
        var expected = x.QR().Solve(y);

        var solver = new HouseholderLeastSquares(rows + 10, columns);
        var design = solver.Design(rows);
        for (var j = 0; j < columns; j++)
        {
            for (var i = 0; i < rows; i++)
            {
                design[(j * rows) + i] = x[i, j];
            }
        }

        var actual = new double[columns];
        solver.Solve(rows, y.ToArray(), actual);
        for (var j = 0; j < columns; j++)
        {
            Assert.Equal(BitConverter.DoubleToInt64Bits(expected[j]), BitConverter.DoubleToInt64Bits(actual[j]));
        }
    }

    [Fact]
    public void Solve_ReusedBuffers_GiveTheSameAnswerAsAFreshSolver()
    {
        // Common practice, no source: a walk-forward refit reuses one solver, so a smaller design after a larger one
        // must not read what the larger one left behind.
        double[] Fill(Span<double> design, int rows)
        {
            var r = new Random(rows);
            for (var i = 0; i < design.Length; i++)
            {
                design[i] = i < rows ? 1.0 : r.NextDouble();
            }

            var y = new double[rows];
            for (var i = 0; i < rows; i++)
            {
                y[i] = r.NextDouble();
            }

            return y;
        }

        var reused = new HouseholderLeastSquares(500, 3);
        var big = Fill(reused.Design(500), 500);
        reused.Solve(500, big, new double[3]);
        var small = Fill(reused.Design(120), 120);
        var again = new double[3];
        reused.Solve(120, small, again);

        var fresh = new HouseholderLeastSquares(120, 3);
        var first = new double[3];
        fresh.Solve(120, Fill(fresh.Design(120), 120), first);
        Assert.Equal(first, again);
    }
}
