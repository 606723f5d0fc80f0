using System.Text.RegularExpressions;
using Tessel.Cli;
using Tessel.Core.Jobs;
using Tessel.Core.Targets;
using Tessel.Output.IO;

namespace Tessel.Tests.Hardening;

/// <summary>One bad (or possibly accidentally valid) input: a job file's bytes plus the category it
/// was made for, written next to the shared support files (a small PNG and OBJ) before it runs.</summary>
public sealed record FuzzCase(string Category, string Name, byte[] Bytes);

/// <summary>Runs cases through the command line in-process and checks the error contract: a clean
/// exit, one line on stderr that starts "tessel: " and names a field path or the file, and no output
/// folder. Problems are collected, not thrown, so one run reports every failing case.</summary>
internal static partial class CliHarness
{
    /// <summary>A case may run at most this long before it is reported as a hang.</summary>
    // A guard against hangs only, never a speed check: the slowest case, a full Debug build of a valid
    // mutant, took 52 s on a quiet machine and more than twice that beside three other engineers'
    // builds on two cores; a hang is anything far beyond, so the cap is many times the measured time.
    public static readonly TimeSpan Timeout = TimeSpan.FromMinutes(15);

    private static readonly HashSet<string> Known = new(JobLoader.KnownFieldPaths(), StringComparer.Ordinal);

    public static (int Code, string Out, string Err, Exception? Escaped, bool Hung) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        Exception? escaped = null;
        int code = -1;
        var task = Task.Run(() =>
        {
            try { code = Program.Run(args, o, e); }
            catch (Exception x) { escaped = x; }
        });
        bool done = task.Wait(Timeout);
        return (code, o.ToString(), e.ToString(), escaped, !done);
    }

    /// <summary>What the loader, the target factory and the family's generator say about a job file: null when valid, otherwise
    /// the JobError. Anything else is a crash and is recorded.</summary>
    public static (bool Valid, string? Crash) Oracle(string file)
    {
        try
        {
            var job = JobLoader.Load(file);
            var target = TargetFactory.Build(job.Target, job.BaseDirectory, HeightMapImage.Decode);
            // validate also refuses a family that cannot make a pattern on the target.
            Tessel.Cli.Commands.CheckFamilyServes(job, target);
            return (true, null);
        }
        catch (JobError) { return (false, null); }
        catch (Exception x) { return (false, $"loader/target threw {x.GetType().Name}: {x.Message}"); }
    }

    /// <summary>Runs validate and build on <paramref name="file"/>; returns the problems found (empty when
    /// the case behaves) and whether the input turned out valid.</summary>
    public static (List<string> Problems, bool Valid) Check(string file, string outRoot, bool build = true) =>
        Check(file, outRoot, _ => build);

    /// <summary>As above; <paramref name="buildIf"/> decides from the loader's verdict (valid or not)
    /// whether to run the (slower, for valid jobs) build as well.</summary>
    public static (List<string> Problems, bool Valid) Check(string file, string outRoot, Func<bool, bool> buildIf)
    {
        var problems = new List<string>();
        var (valid, crash) = Oracle(file);
        if (crash is not null) problems.Add(crash);

        var v = Run("validate", file);
        problems.AddRange(Contract("validate", v, file, valid));

        if (buildIf(valid))
        {
            string outDir = Path.Combine(outRoot, "out-" + Path.GetFileNameWithoutExtension(file));
            var b = Run("build", file, "--out", outDir, "--quiet");
            if (b.Hung || b.Escaped is not null) problems.AddRange(Contract("build", b, file, valid));
            else if (b.Code == ExitCodes.Ok)
            {
                if (!valid) problems.Add("build: exit 0 for a job the loader refuses");
                if (!File.Exists(Path.Combine(outDir, "summary.json"))) problems.Add("build: exit 0 but no summary.json");
            }
            else if (b.Code == ExitCodes.NotConverged && valid)
            {
                // An honest "the fit did not converge": one line, and at most the target files and a
                // summary that says so (never sheets).
                var lines = b.Err.Split('\n', StringSplitOptions.RemoveEmptyEntries);
                if (lines.Length != 1 || !lines[0].StartsWith("tessel: ", StringComparison.Ordinal))
                    problems.Add($"build: exit 2 without exactly one 'tessel: ' line: {b.Err.Trim()}");
                if (Directory.Exists(Path.Combine(outDir, "sheets"))) problems.Add("build: exit 2 but sheets were written");
            }
            else
            {
                // A valid job may still fail in a later stage; it must then fail cleanly too.
                problems.AddRange(Contract("build", b, file, valid: false));
                if (Directory.Exists(outDir) && Directory.EnumerateFileSystemEntries(outDir).Any())
                    problems.Add($"build: failed with exit {b.Code} but wrote into {outDir}");
            }
        }
        return (problems, valid);
    }

    private static IEnumerable<string> Contract(string verb, (int Code, string Out, string Err, Exception? Escaped, bool Hung) r, string file, bool valid)
    {
        if (r.Hung) { yield return $"{verb}: hung for more than {Timeout.TotalSeconds} s"; yield break; }
        if (r.Escaped is not null) { yield return $"{verb}: exception escaped Program.Run: {r.Escaped.GetType().Name}: {r.Escaped.Message}"; yield break; }
        if (valid)
        {
            if (r.Code != ExitCodes.Ok) yield return $"{verb}: valid job gave exit {r.Code}: {r.Err.Trim()}";
            yield break;
        }
        if (r.Code != ExitCodes.BadInput) yield return $"{verb}: exit {r.Code}, expected {ExitCodes.BadInput}: {r.Err.Trim()}";
        foreach (var p in LineProblems(r.Err, file)) yield return $"{verb}: {p}";
    }

    /// <summary>Checks that stderr is one line "tessel: WHERE: PROBLEM" whose WHERE is a known field
    /// path (or an unknown field's path, reported as unknown), the job file with line:column, or an
    /// input file named in the message.</summary>
    public static IEnumerable<string> LineProblems(string stderr, string file)
    {
        var lines = stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        if (lines.Length != 1) { yield return $"stderr has {lines.Length} lines: {Clip(stderr)}"; yield break; }
        string line = lines[0].TrimEnd('\r');
        if (!line.StartsWith("tessel: ", StringComparison.Ordinal)) { yield return $"stderr does not start 'tessel: ': {Clip(line)}"; yield break; }
        if (line.Contains("internal error", StringComparison.Ordinal)) { yield return $"crash: {Clip(line)}"; yield break; }
        string rest = line["tessel: ".Length..];
        string fileName = Path.GetFileName(file);
        if (rest.StartsWith(fileName + ":", StringComparison.Ordinal))
        {
            if (!SyntaxWhere().IsMatch(rest[fileName.Length..]))
                yield return $"a job-file error must give line:column: {Clip(line)}";
            yield break;
        }
        if (rest.StartsWith(file, StringComparison.Ordinal)) yield break; // "could not read <path>"
        int colon = rest.IndexOf(": ", StringComparison.Ordinal);
        if (colon <= 0) { yield return $"no 'where: problem' in {Clip(line)}"; yield break; }
        string where = rest[..colon], problem = rest[(colon + 2)..];
        if (!NamesAPlace(where, problem)) yield return $"'{where}' is not a field path or file: {Clip(line)}";
    }

    private static bool NamesAPlace(string where, string problem)
    {
        if (where == "job") return true;
        // An input file: "mesh.obj:12", "mesh.stl", or a target field whose message names the file.
        if (InputFile().IsMatch(where)) return true;
        string path = Index().Replace(where, "");
        if (Known.Contains(path)) return true;
        int dot = path.LastIndexOf('.');
        string parent = dot < 0 ? "" : path[..dot];
        bool parentKnown = parent == "" || Known.Any(k => k.StartsWith(parent + ".", StringComparison.Ordinal));
        return parentKnown && (problem.StartsWith("unknown field", StringComparison.Ordinal) || problem.StartsWith("appears twice", StringComparison.Ordinal));
    }

    private static string Clip(string s) => s.Length <= 300 ? s : s[..300] + "...";

    [GeneratedRegex(@"^:\d+:\d+: malformed JSON: ")]
    private static partial Regex SyntaxWhere();

    [GeneratedRegex(@"^[^/\s]+\.(obj|stl|png|OBJ|STL|PNG)(:\d+)?$")]
    private static partial Regex InputFile();

    [GeneratedRegex(@"\[\d+\]")]
    private static partial Regex Index();
}
