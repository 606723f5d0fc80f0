namespace Tessel.Core.Sheets;

/// <summary>What became of a crease that was to be perforated.</summary>
public enum PerforationKind
{
    /// <summary>At least two cut/bridge cycles fit: a regular dash pattern.</summary>
    Pattern,
    /// <summary>Too short for two cycles: one centred slot.</summary>
    Slot,
    /// <summary>Too short even for a slot: scored instead.</summary>
    Score,
}

/// <summary>Cuts along a crease of length L as parameter intervals [Start, End] in mm from its first end.</summary>
public sealed record PerforationPlan(PerforationKind Kind, (double Start, double End)[] Cuts);

/// <summary>Lays out perforation dashes (docs/reference/fabrication.md [CP/M]): every crease starts and ends with at least
/// a half bridge, keeps an uncut zone around each end vertex, and keeps the material's exact cut and bridge
/// lengths; what is left over is split evenly between the two ends.</summary>
public static class Perforation
{
    /// <param name="length">Crease length L, mm.</param>
    /// <param name="cut">Dash length c, mm.</param>
    /// <param name="bridge">Bridge length b, mm.</param>
    /// <param name="vertexZone">Uncut distance kept from each end vertex, mm (max(1 mm, 2 t)).</param>
    public static PerforationPlan Plan(double length, double cut, double bridge, double vertexZone)
    {
        if (!(cut > 0) || !(bridge > 0)) throw new ArgumentOutOfRangeException(nameof(cut), "cut and bridge must be positive");
        double endGap = Math.Max(vertexZone, bridge / 2);
        double room = length - 2 * endGap;
        // n dashes need n c + (n - 1) b.
        int n = room >= cut ? (int)Math.Floor((room + bridge) / (cut + bridge) + 1e-12) : 0;
        if (n >= 2)
        {
            double used = n * cut + (n - 1) * bridge;
            double start = endGap + (room - used) / 2;
            var cuts = new (double, double)[n];
            for (int k = 0; k < n; k++)
            {
                double s = start + k * (cut + bridge);
                cuts[k] = (s, s + cut);
            }
            return new PerforationPlan(PerforationKind.Pattern, cuts);
        }
        // A slot shorter than half a dash would hardly weaken the fold: score instead.
        if (room >= cut / 2)
        {
            double slot = Math.Min(cut, room);
            double s = (length - slot) / 2;
            return new PerforationPlan(PerforationKind.Slot, [(s, s + slot)]);
        }
        return new PerforationPlan(PerforationKind.Score, []);
    }
}
