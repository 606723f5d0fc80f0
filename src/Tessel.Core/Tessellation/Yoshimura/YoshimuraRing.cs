namespace Tessel.Core.Tessellation.Yoshimura;

/// <summary>Closed-form folded state of a Yoshimura (diamond) pattern with every vertex on a circular
/// cylinder of radius R (Yoshimura, NACA TM 1390, 1955; Guest &amp; Pellegrino, "The folding of
/// triangulated cylinders, Part I", J. Appl. Mech. 61, 1994).</summary>
/// <remarks>
/// Each ring of vertices is a polygon inscribed in the circle: consecutive ring vertices are phi apart
/// (chord w = 2 R sin(phi/2), the horizontal crease), and the next ring sits t further along the axis,
/// turned by phi/2. The flat pattern is a strip of isosceles triangles with base w and height h; the
/// diagonal crease joins (R, theta, 0) to (R, theta + phi/2, t), so its folded length squared is
/// (2 R sin(phi/4))^2 + t^2, and equating it with the flat w^2/4 + h^2 gives (derived here)
/// h^2 = t^2 + 4 R^2 sin^4(phi/4). Every triangle is congruent to its flat image, so the six sectors
/// beta, alpha, beta, beta, alpha, beta at a vertex (tan beta = 2h/w, alpha = pi - 2 beta) sum to 2 pi
/// and their alternating sum is 0: developable and Kawasaki by construction.
/// </remarks>
/// <param name="Radius">Cylinder radius R, metres.</param>
/// <param name="ChordAngle">Angle phi between consecutive vertices of one ring, radians (2 pi / n for a
/// closed ring of n triangles).</param>
/// <param name="AxialPitch">Distance t along the axis between consecutive rings, metres.</param>
public readonly record struct YoshimuraRing(double Radius, double ChordAngle, double AxialPitch)
{
    /// <summary>Horizontal crease (triangle base) w = 2 R sin(phi/2).</summary>
    public double Chord => 2 * Radius * Math.Sin(ChordAngle / 2);

    /// <summary>Triangle height in the flat pattern, h = sqrt(t^2 + 4 R^2 sin^4(phi/4)).</summary>
    public double FlatHeight
    {
        get
        {
            double s = Math.Sin(ChordAngle / 4);
            return Math.Sqrt(AxialPitch * AxialPitch + 4 * Radius * Radius * s * s * s * s);
        }
    }

    /// <summary>Diagonal crease length sqrt(w^2/4 + h^2), the same flat and folded.</summary>
    public double Diagonal => Math.Sqrt(Chord * Chord / 4 + FlatHeight * FlatHeight);

    /// <summary>Base angle beta of the flat triangle: tan(beta) = 2h / w.</summary>
    public double Beta => Math.Atan2(2 * FlatHeight, Chord);

    /// <summary>Apex angle alpha = pi - 2 beta.</summary>
    public double Alpha => Math.PI - 2 * Beta;

    /// <summary>The ring of n triangles that closes a full cylinder from a flat triangle of base w and
    /// height h: R = w / (2 sin(pi/n)), t = sqrt(h^2 - 4 R^2 sin^4(pi/(2n))) (derived here from the
    /// relation above). Throws when h is too small for the ring to close (t^2 &lt; 0).</summary>
    public static YoshimuraRing ClosedRing(double chord, double flatHeight, int trianglesPerRing)
    {
        if (trianglesPerRing < 3) throw new ArgumentOutOfRangeException(nameof(trianglesPerRing), "a ring needs at least 3 triangles");
        double phi = 2 * Math.PI / trianglesPerRing;
        double r = chord / (2 * Math.Sin(phi / 2));
        double s = Math.Sin(phi / 4);
        double t2 = flatHeight * flatHeight - 4 * r * r * s * s * s * s;
        if (!(t2 >= 0))
            throw new ArgumentException($"a triangle of height {flatHeight} m is too flat to close a ring of {trianglesPerRing} triangles of base {chord} m; the height must exceed {2 * r * s * s:0.####} m", nameof(flatHeight));
        return new YoshimuraRing(r, phi, Math.Sqrt(t2));
    }
}
