using Tessel.Core.Geometry;
using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>Which pass of the laser a line belongs to; the enum order is the cutting order: marks and
/// scores before any cut, inner cuts before the outline so a part never moves before it is finished.</summary>
internal enum LaserPass { Annotation, Label, BackLabel, Score, BackScore, PerforationCut, InnerCut, OutlineCut }

/// <summary>A line with where it belongs while the sheets are put together.</summary>
/// <param name="Part">Part (from 0) the line is on.</param>
/// <param name="Order">Sort key within the part and pass (edge index for creases).</param>
/// <param name="Class">Line class, giving its layer.</param>
/// <param name="Points">Polyline on the sheet, mm (front coordinates, even for back-job lines).</param>
/// <param name="Closed">True for a closed ring.</param>
/// <param name="Pass">The laser pass.</param>
internal sealed record PendingLine(int Part, int Order, LineClass Class, Vec2[] Points, bool Closed, LaserPass Pass);
