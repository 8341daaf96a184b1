using System.Globalization;
using System.Text;

namespace VolCast.Cli.Batch;

/// <summary>
/// One shard of a batch: shard <see cref="Index"/> of <see cref="Count"/> (0-based) computes the names whose stable hash
/// falls on it. The hash is 64-bit FNV-1a of the name's UTF-8 bytes, modulo the count, so it is the same on every machine
/// and in every process, and adding a name never moves the others.
/// </summary>
/// <param name="Index">The shard, 0-based.</param>
/// <param name="Count">How many shards the batch is split into.</param>
internal sealed record BatchShard(int Index, int Count)
{
    /// <summary>The largest shard count accepted.</summary>
    public const int MaxCount = 100_000;

    /// <summary>The Kubernetes indexed job's variable: this pod's completion index.</summary>
    public const string KubernetesIndex = "JOB_COMPLETION_INDEX";

    /// <summary>The Slurm job array's variable: this task's id.</summary>
    public const string SlurmTaskId = "SLURM_ARRAY_TASK_ID";

    /// <summary>The Slurm job array's variable: how many tasks the array has.</summary>
    public const string SlurmTaskCount = "SLURM_ARRAY_TASK_COUNT";

    /// <summary>The Slurm job array's variable: the lowest task id (an array may start at 1).</summary>
    public const string SlurmTaskMin = "SLURM_ARRAY_TASK_MIN";

    /// <summary>The Slurm job array's variable: the highest task id.</summary>
    public const string SlurmTaskMax = "SLURM_ARRAY_TASK_MAX";

    private const string ValidForm = "the valid form is --shard K/N with whole numbers 0 ≤ K < N (shard K of N, counted from 0, N at most 100000), for example --shard 0/4 … --shard 3/4, or --shard auto inside a Kubernetes indexed job or a Slurm job array";

    /// <summary>Whether this shard computes <paramref name="name"/>.</summary>
    public bool Owns(string name) => (int)(Hash(name) % (ulong)Count) == Index;

    /// <summary>The shard as the user writes it, <c>K/N</c>.</summary>
    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Index}/{Count}");

    /// <summary>64-bit FNV-1a of the UTF-8 bytes of <paramref name="name"/> (offset basis 0xcbf29ce484222325, prime 0x100000001b3).</summary>
    public static ulong Hash(string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        var hash = 0xcbf29ce484222325UL;
        foreach (var b in Encoding.UTF8.GetBytes(name))
        {
            hash ^= b;
            hash *= 0x100000001b3UL;
        }

        return hash;
    }

    /// <summary>Reads <c>--shard K/N</c>; <c>auto</c> is resolved by <see cref="FromEnvironment"/>.</summary>
    /// <exception cref="UsageException">The value is not K/N with 0 ≤ K &lt; N.</exception>
    public static BatchShard Parse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var slash = text.IndexOf('/', StringComparison.Ordinal);
        if (slash > 0
            && int.TryParse(text.AsSpan(0, slash), NumberStyles.None, CultureInfo.InvariantCulture, out var k)
            && int.TryParse(text.AsSpan(slash + 1), NumberStyles.None, CultureInfo.InvariantCulture, out var n)
            && n is >= 1 and <= MaxCount && k < n)
        {
            return new BatchShard(k, n);
        }

        var why = slash > 0
            && int.TryParse(text.AsSpan(0, slash), NumberStyles.None, CultureInfo.InvariantCulture, out var k2)
            && int.TryParse(text.AsSpan(slash + 1), NumberStyles.None, CultureInfo.InvariantCulture, out var n2)
            ? (n2 == 0 ? "there must be at least one shard" : n2 > MaxCount ? "too many shards" : $"shard {k2} does not exist among {n2} shards numbered 0 to {n2 - 1}")
            : "it is not two whole numbers K/N";
        throw new UsageException($"--shard {Shown(text)}: {why}; {ValidForm}.");
    }

    /// <summary>
    /// Resolves <c>--shard auto</c> from the scheduler's variables: a Kubernetes indexed job's <c>JOB_COMPLETION_INDEX</c>
    /// with the count from <c>--shards N</c>, or a Slurm job array's <c>SLURM_ARRAY_TASK_ID</c> and
    /// <c>SLURM_ARRAY_TASK_COUNT</c> (less <c>SLURM_ARRAY_TASK_MIN</c> when the array does not start at 0).
    /// </summary>
    /// <param name="variable">Reads an environment variable (null when unset).</param>
    /// <param name="shards">The count from <c>--shards</c>, or null.</param>
    /// <exception cref="UsageException">No scheduler's variables are set, both are, or they do not agree.</exception>
    public static BatchShard FromEnvironment(Func<string, string?> variable, int? shards)
    {
        ArgumentNullException.ThrowIfNull(variable);
        var k8s = variable(KubernetesIndex);
        var slurm = variable(SlurmTaskId);
        if (k8s is not null && slurm is not null)
        {
            throw new UsageException($"--shard auto: both {KubernetesIndex} ({k8s}) and {SlurmTaskId} ({slurm}) are set, so the shard is ambiguous; unset the one that does not belong to this job, or give --shard K/N.");
        }

        if (k8s is not null)
        {
            var index = Whole(KubernetesIndex, k8s);
            if (shards is not int n)
            {
                throw new UsageException($"--shard auto: {KubernetesIndex}={k8s} gives this pod's index but not the number of shards; add --shards N with N the job's completions (spec.completions).");
            }

            if (index >= n)
            {
                throw new UsageException($"--shard auto: {KubernetesIndex}={k8s} is not below --shards {n}; --shards must equal the job's completions (spec.completions), so indexes run from 0 to N-1.");
            }

            return new BatchShard(index, n);
        }

        if (slurm is not null)
        {
            var id = Whole(SlurmTaskId, slurm);
            var countText = variable(SlurmTaskCount)
                ?? throw new UsageException($"--shard auto: {SlurmTaskId}={slurm} is set but {SlurmTaskCount} is not, so the number of shards is unknown; run inside a job array (sbatch --array=0-N) or give --shard K/N.");
            var count = Whole(SlurmTaskCount, countText);
            var minText = variable(SlurmTaskMin);
            var min = minText is null ? 0 : Whole(SlurmTaskMin, minText);
            var maxText = variable(SlurmTaskMax);
            if (count < 1 || count > MaxCount)
            {
                throw new UsageException($"--shard auto: {SlurmTaskCount}={countText} is not a usable number of shards (1 to {MaxCount}).");
            }

            if (maxText is not null && Whole(SlurmTaskMax, maxText) - min + 1 != count)
            {
                throw new UsageException($"--shard auto: {SlurmTaskMin}={min}, {SlurmTaskMax}={maxText} and {SlurmTaskCount}={countText} do not agree; the array must be one unbroken range without a step, such as sbatch --array=0-{count - 1}.");
            }

            if (id < min || id - min >= count)
            {
                throw new UsageException($"--shard auto: {SlurmTaskId}={slurm} lies outside the array of {SlurmTaskCount}={countText} tasks starting at {SlurmTaskMin}={min}.");
            }

            if (shards is int given && given != count)
            {
                throw new UsageException($"--shard auto: --shards {given} does not agree with {SlurmTaskCount}={countText}; leave --shards out under Slurm or make them equal.");
            }

            return new BatchShard(id - min, count);
        }

        // Slurm sets the array's count, minimum and maximum together with the task id; one of them without the id is a job that is not what it seems.
        var partial = new[] { SlurmTaskCount, SlurmTaskMin, SlurmTaskMax }.Where(v => variable(v) is not null).Select(v => v + "=" + Shown(variable(v)!)).ToArray();
        if (partial.Length > 0)
        {
            throw new UsageException($"--shard auto: {string.Join(", ", partial)} is set but {SlurmTaskId} is not, so this task's place in the array is unknown; run it as a task of a job array (sbatch --array=0-N), or give --shard K/N.");
        }

        throw new UsageException($"--shard auto: neither {KubernetesIndex} (a Kubernetes indexed job, with --shards N) nor {SlurmTaskId} and {SlurmTaskCount} (a Slurm job array) is set; run inside one of them or give --shard K/N.");
    }

    private static int Whole(string name, string text) =>
        int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out var value)
            ? value
            : throw new UsageException(text.Length == 0
                ? $"--shard auto: {name} is set but empty; the scheduler sets it to a whole number of at least 0, so unset it or give --shard K/N."
                : $"--shard auto: {name}={Shown(text)} is not a whole number of at least 0.");

    private static string Shown(string text) => text.Length > 40 ? text[..40] + "…" : text;
}
