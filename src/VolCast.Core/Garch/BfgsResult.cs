namespace VolCast.Core.Garch;

/// <summary>Where a BFGS minimization stopped.</summary>
/// <param name="Point">The last accepted point.</param>
/// <param name="Value">The objective at <paramref name="Point"/>.</param>
/// <param name="Gradient">The gradient at <paramref name="Point"/>.</param>
/// <param name="InverseHessian">The final inverse-Hessian approximation (row-major, dimension²), reusable as a warm start.</param>
/// <param name="Iterations">Accepted steps taken.</param>
/// <param name="Converged">Whether the gradient test was met.</param>
/// <param name="Message">Why it stopped, in a sentence.</param>
internal sealed record BfgsResult(
    double[] Point,
    double Value,
    double[] Gradient,
    double[] InverseHessian,
    int Iterations,
    bool Converged,
    string Message);
