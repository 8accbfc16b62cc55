//! Everything printed output needs about one job, gathered in one place.

use glam::{DVec2, DVec3};
use pitchframe_geometry::{LengthStyle, Roof, RoofLineKind};
use serde::Serialize;

use crate::{LumberOrder, MemberCard};

/// One job's printed-output input: the plan, the roof, every distinct
/// member and the lumber order.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CardDeck {
    /// The job's name, printed on every page.
    pub title: String,
    /// How lengths are written.
    pub length_style: LengthStyle,
    /// The wall-line rings: the outer walls first, then any courtyards.
    pub outline: Vec<Vec<DVec2>>,
    /// The solved roof.
    pub roof: Roof,
    /// One card per distinct member.
    pub members: Vec<MemberCard>,
    /// Warnings about the frame as a whole, in words.
    pub warnings: Vec<String>,
    /// The lumber order, when one was made.
    pub lumber: Option<LumberOrder>,
}

/// One roof plane in the summary.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct PlaneSummary {
    /// The wall the plane rises from, numbered from 1.
    pub wall_number: usize,
    /// The plane's rise per 12 of run.
    pub rise_in_12: f64,
    /// The plane's sloped area to the wall line, square inches.
    pub area_sq_in: f64,
    /// The same carried out to the fascia, square inches.
    pub eave_area_sq_in: f64,
}

/// The roof in figures, for the cover sheet.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct RoofSummary {
    /// One entry per plane.
    pub planes: Vec<PlaneSummary>,
    /// Each ridge's height above the wall line, inches.
    pub ridge_heights_in: Vec<f64>,
    /// How many hips, valleys and ridges.
    pub line_counts: [usize; 3],
    /// Pieces to cut, over all members.
    pub piece_count: u32,
}

/// The area of a flat polygon in space (the magnitude of half the sum of
/// the cross products of its corners).
fn polygon_area(points: &[DVec3]) -> f64 {
    let Some(&first) = points.first() else { return 0.0 };
    let mut sum = DVec3::ZERO;
    for (a, b) in points.iter().zip(points.iter().skip(1).chain(std::iter::once(&first))) {
        sum += (*a - first).cross(*b - first);
    }
    0.5 * sum.length()
}

impl CardDeck {
    /// The roof in figures: planes and their areas, ridge heights, counts.
    pub fn roof_summary(&self) -> RoofSummary {
        let planes = self
            .roof
            .planes
            .iter()
            .map(|plane| PlaneSummary {
                wall_number: plane.wall + 1,
                rise_in_12: plane.rise_per_run * 12.0,
                area_sq_in: polygon_area(&plane.outline),
                eave_area_sq_in: polygon_area(&plane.eave_outline),
            })
            .collect();
        let count = |kind| self.roof.lines.iter().filter(|line| line.kind == kind).count();
        RoofSummary {
            planes,
            ridge_heights_in: self
                .roof
                .lines
                .iter()
                .filter(|line| line.kind == RoofLineKind::Ridge)
                .map(|line| 0.5 * (line.from.z + line.to.z))
                .collect(),
            line_counts: [count(RoofLineKind::Hip), count(RoofLineKind::Valley), count(RoofLineKind::Ridge)],
            piece_count: self.members.iter().map(|member| member.count).sum(),
        }
    }
}
