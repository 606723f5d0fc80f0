using System.Globalization;
using System.Text;

namespace Tessel.Tests.Targets;

/// <summary>OBJ text of an invented test shape: an annular sector of a gentle dome, a mesh whose plan is
/// not a rectangle. Shared by the tests and the robustness benchmark (linked there).</summary>
public static class RingSectorMesh
{
    /// <summary>Radii r0..r1 m, angles a0..a1 degrees, nr x na quads split in two, on z = 1.2 - 0.05 r^2.</summary>
    public static string Obj(double r0 = 2.0, double r1 = 4.2, double a0 = 0, double a1 = 110, int nr = 14, int na = 28)
    {
        var sb = new StringBuilder("# annular sector of a gentle dome (invented test shape), metres\n");
        for (int i = 0; i <= nr; i++)
            for (int k = 0; k <= na; k++)
            {
                double r = r0 + (r1 - r0) * i / nr, a = (a0 + (a1 - a0) * k / na) * Math.PI / 180;
                sb.Append(CultureInfo.InvariantCulture, $"v {r * Math.Cos(a):F6} {r * Math.Sin(a):F6} {1.2 - 0.05 * r * r:F6}\n");
            }
        for (int i = 0; i < nr; i++)
            for (int k = 0; k < na; k++)
            {
                int a = i * (na + 1) + k + 1, b = a + 1, c = a + na + 1, d = c + 1;
                sb.Append(CultureInfo.InvariantCulture, $"f {a} {c} {d}\nf {a} {d} {b}\n");
            }
        return sb.ToString();
    }
}
