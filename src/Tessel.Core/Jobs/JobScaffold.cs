using System.Text;

namespace Tessel.Core.Jobs;

/// <summary>Writes a commented starting job file for a target kind and family. Every value is valid
/// as written; the comments say what to change.</summary>
public static class JobScaffold
{
    /// <summary>Job file text (JSON with comments) for <paramref name="kind"/> and <paramref name="family"/>.</summary>
    /// <exception cref="JobError">Unknown kind ("--target") or family ("--family").</exception>
    public static string Text(string kind, string family)
    {
        Check("--target", kind, Catalog.TargetKinds);
        Check("--family", family, Catalog.Families);
        var sb = new StringBuilder();
        sb.Append($$"""
            // Tessel job file, started by 'tessel scaffold'. JSON with comments and trailing commas.
            // Every field is listed in README.md (section "Job files") and in patterns/tessel-job.schema.json.
            {
              // Outputs go to output/<name>/; letters, digits, '-', '_' and '.' only.
              "name": "{{kind}}-{{family}}",
              "description": "Describe the project and the question this model answers.",
              "seed": 1,

              "target": {
                "kind": "{{kind}}",
                // Length unit of every target value below: m, cm, mm, in or ft.
                "units": "m",

            """);
        var targetKind = JobVocabulary.Registered.Kind(kind)!;
        sb.Append(targetKind.ScaffoldLines);
        sb.Append(targetKind.FootprintOptional switch
        {
            true => """

                    // The footprint may be left out: it then covers the whole image or mesh in plan.
                    // "footprint": { "width": 12, "depth": 10 },
                  },

                """,
            _ => """

                    // Plan region: a width x depth rectangle centred on the origin, or "corners": [[x, y], ...].
                    "footprint": { "width": 12, "depth": 10 },
                  },

                """,
        });
        sb.Append($$"""
              "tessellation": {
                // {{string.Join(", ", Catalog.Families.Select(f => f.Name))}}
                "family": "{{family}}",
                // Few cells build in seconds; raise them once the job builds.
                "cellsX": 8,
                "cellsY": 6,
                // Acute sector angle of the starting cell, degrees.
                "sectorAngleDeg": 60,
                "orientationDeg": 0,
              },

              "fitting": {
                // Allowed developability residual per vertex in degrees; 0 = exact.
                "epsilonDeg": 0,
                "starts": 2,
                // Room for the slow final phase of small irregular nets; most fits stop far sooner.
                "maxIterations": 1000,
                "anchors": "none",
                "bounds": { "minSectorAngleDeg": 5, "maxSectorAngleDeg": 175, "minEdgeLengthMm": 3 },
              },

              "fabrication": {
                // Model scale 1:n, or "auto": the largest common scale whose facets are at least
                // 10 x the material's thickness with the parts on maxSheets sheets.
                "scale": "auto",
                "maxSheets": 1,
                // See 'tessel catalog materials'.
                "material": "card",
                "foldMethod": { "mountain": "material", "valley": "material" },
                // See 'tessel catalog sheets', or give { "widthMm": ..., "heightMm": ... }.
                "sheet": { "name": "A3" },
                "orientation": "auto",
                "marginMm": 8,
                "spacingMm": 3,
                "kerfMm": 0.15,
                "tab": { "widthMm": 6, "taperDeg": 40 },
              },

              "outputs": { "obj": true, "png": true },
            }

            """);
        return sb.ToString();
    }

    private static void Check(string option, string value, IReadOnlyList<CatalogEntry> choices)
    {
        if (choices.Any(c => c.Name == value)) return;
        string? near = EditDistance.Nearest(value, choices.Select(c => c.Name));
        throw new JobError(option, $"{(near is null ? "" : $"did you mean \"{near}\"? ")}must be one of {string.Join(", ", choices.Select(c => c.Name))} (got \"{value}\")");
    }
}
