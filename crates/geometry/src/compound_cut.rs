//! A compound (cheek) cut: a sloping member meeting a plumb face that is
//! not square to it in plan, as a jack meets a hip or a hip meets a ridge.
//!
//! Every angle is worked out twice: from the trade's closed-form formulas
//! ([`CompoundCut::closed_form`]) and from 3D vectors
//! ([`CompoundCut::by_vectors`]); the tests hold the two together.
//!
//! With theta the member's pitch and gamma the angle in plan between the
//! plumb face and the member's square line:
//! - plumb line on the side face: theta from square (square: 12 and 12 tan theta);
//! - line across the top edge: tan(phi) = tan(gamma) / cos(theta) from square;
//! - saw riding the side face along the plumb line: bevel = gamma;
//! - saw riding the top edge along the top-edge line:
//!   sin(B) = cos(gamma) sin(theta). (Derivation: the cut plane's normal is
//!   level, at gamma from the member's axis in plan; its component along the
//!   top face's normal is cos(gamma) sin(theta), and that component is the
//!   sine of the blade's tilt from square to the shoe.)

use std::f64::consts::FRAC_PI_2;
use std::fmt;

use glam::{DQuat, DVec3};

use crate::AngleSetting;

/// The four angles of a compound cut, in radians.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CutAngles {
    /// Plumb line on the side face, from square to the member's edge.
    pub plumb_line_from_square_rad: f64,
    /// Cut line across the top edge, from square to the member's edge.
    pub top_edge_line_from_square_rad: f64,
    /// Saw bevel with the shoe on the side face, cutting along the plumb line.
    pub face_bevel_rad: f64,
    /// Saw bevel with the shoe on the top edge, cutting along the top-edge line.
    pub edge_bevel_rad: f64,
}

/// A miter-saw setting: the table's turn and the blade's tilt.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MiterSetting {
    /// Miter (turn of the table) from square, in radians.
    pub miter_rad: f64,
    /// Bevel (tilt of the blade) from square to the table, in radians.
    pub bevel_rad: f64,
}

/// A framing-square setting for a line: `against` on one arm, `figure` on
/// the other, both on the same edge of the board.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SquareFigures {
    /// The figure on the arm that is not marked along.
    pub against: f64,
    /// The figure on the arm the line is drawn along.
    pub figure: f64,
}

/// A cut the saw cannot make as set up.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum CutWarning {
    /// The bevel with the saw riding the side face is past the saw's limit.
    FaceBevelBeyondSaw {
        /// The bevel needed, in radians.
        bevel_rad: f64,
        /// The saw's limit, in radians.
        max_rad: f64,
        /// The bevel with the saw on the top edge instead, in radians.
        edge_bevel_rad: f64,
    },
    /// The bevel with the saw riding the top edge is past the saw's limit.
    EdgeBevelBeyondSaw {
        /// The bevel needed, in radians.
        bevel_rad: f64,
        /// The saw's limit, in radians.
        max_rad: f64,
        /// The bevel with the saw on the side face instead, in radians.
        face_bevel_rad: f64,
    },
}

impl fmt::Display for CutWarning {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let deg = f64::to_degrees;
        match *self {
            CutWarning::FaceBevelBeyondSaw { bevel_rad, max_rad, edge_bevel_rad } => write!(
                f,
                "with the saw on the side face this cut needs a {:.1} deg bevel, past the saw's \
                 {:.1} deg; {}",
                deg(bevel_rad),
                deg(max_rad),
                other_setup("the saw riding the top edge", edge_bevel_rad, max_rad)
            ),
            CutWarning::EdgeBevelBeyondSaw { bevel_rad, max_rad, face_bevel_rad } => write!(
                f,
                "with the saw on the top edge this cut needs a {:.1} deg bevel, past the saw's \
                 {:.1} deg; {}",
                deg(bevel_rad),
                deg(max_rad),
                other_setup("the saw riding the side face", face_bevel_rad, max_rad)
            ),
        }
    }
}

/// Advice pointing at the other setup, or at hand work when neither fits.
fn other_setup(setup: &str, bevel_rad: f64, max_rad: f64) -> String {
    if bevel_rad <= max_rad {
        format!("cut it with {setup} at {:.1} deg instead", bevel_rad.to_degrees())
    } else {
        "neither saw setup reaches it: mark both lines and finish with a handsaw, or use a saw \
         that tilts further"
            .to_string()
    }
}

/// A cheek cut on a member of pitch theta against a plumb face whose plan
/// trace makes angle gamma with the member's square line.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CompoundCut {
    member_pitch_rad: f64,
    plan_angle_rad: f64,
}

impl CompoundCut {
    /// A cut for a member of pitch `member_pitch_rad` (0 for a level member,
    /// under 90 deg) against a plumb face at `plan_angle_rad` from the
    /// member's square line in plan (0 for a square cut, 45 deg for a
    /// regular hip's jack). The sign of the plan angle only says which hand
    /// the cut is; the numbers are the same. `None` when the face is
    /// parallel to the member, the member is vertical, or an input is not
    /// finite.
    ///
    /// ```
    /// use pitchframe_geometry::CompoundCut;
    /// let pitch = (4.0f64 / 12.0).atan();
    /// let jack = CompoundCut::new(pitch, 45f64.to_radians()).unwrap();
    /// assert!((jack.face_bevel_rad().to_degrees() - 45.0).abs() < 1e-12);
    /// assert!((jack.top_edge_line_from_square_rad().to_degrees() - 46.5).abs() < 0.05);
    /// ```
    pub fn new(member_pitch_rad: f64, plan_angle_rad: f64) -> Option<CompoundCut> {
        let plan_angle_rad = plan_angle_rad.abs();
        let usable = member_pitch_rad.is_finite()
            && plan_angle_rad.is_finite()
            && (0.0..FRAC_PI_2).contains(&member_pitch_rad)
            && plan_angle_rad < FRAC_PI_2;
        // cos of an angle a hair under 90 deg is tiny but positive; the
        // formulas stay finite, so no further tolerance is needed here.
        usable.then_some(CompoundCut { member_pitch_rad, plan_angle_rad })
    }

    /// The member's pitch, in radians.
    pub fn member_pitch_rad(&self) -> f64 {
        self.member_pitch_rad
    }

    /// The plumb face's plan angle from the member's square line, in radians.
    pub fn plan_angle_rad(&self) -> f64 {
        self.plan_angle_rad
    }

    /// Plumb line on the side face, from square: the member's pitch.
    pub fn plumb_line_from_square_rad(&self) -> f64 {
        self.member_pitch_rad
    }

    /// Square setting for the plumb line: 12 and the rise in 12, marking
    /// along the rise.
    pub fn plumb_square_figures(&self) -> SquareFigures {
        SquareFigures { against: 12.0, figure: 12.0 * self.member_pitch_rad.tan() }
    }

    /// Cut line across the top edge, from square: tan(phi) = tan(gamma) / cos(theta).
    pub fn top_edge_line_from_square_rad(&self) -> f64 {
        (self.plan_angle_rad.tan() / self.member_pitch_rad.cos()).atan()
    }

    /// Square setting for the top-edge line: 12 and 12 cos(theta) / tan(gamma),
    /// marking along the 12 arm (the rafter-table side-cut figure). `None`
    /// for a square cut (gamma = 0), which needs no side-cut figure.
    pub fn top_edge_square_figures(&self) -> Option<SquareFigures> {
        let tan_gamma = self.plan_angle_rad.tan();
        (tan_gamma > 0.0)
            .then(|| SquareFigures { against: 12.0 * self.member_pitch_rad.cos() / tan_gamma, figure: 12.0 })
    }

    /// Saw bevel with the shoe on the side face, cutting along the plumb
    /// line: gamma, whatever the pitch, because both the cut plane and the
    /// unbevelled blade contain the plumb line.
    pub fn face_bevel_rad(&self) -> f64 {
        self.plan_angle_rad
    }

    /// Saw bevel with the shoe on the top edge, cutting along the top-edge
    /// line: sin(B) = cos(gamma) sin(theta).
    pub fn edge_bevel_rad(&self) -> f64 {
        (self.plan_angle_rad.cos() * self.member_pitch_rad.sin()).asin()
    }

    /// Miter saw, member lying on its side face: miter theta, bevel gamma.
    pub fn miter_saw_flat(&self) -> MiterSetting {
        MiterSetting { miter_rad: self.plumb_line_from_square_rad(), bevel_rad: self.face_bevel_rad() }
    }

    /// Miter saw, member standing on its top edge: miter phi, bevel B.
    pub fn miter_saw_on_edge(&self) -> MiterSetting {
        MiterSetting { miter_rad: self.top_edge_line_from_square_rad(), bevel_rad: self.edge_bevel_rad() }
    }

    /// All four angles from the closed-form formulas.
    pub fn closed_form(&self) -> CutAngles {
        CutAngles {
            plumb_line_from_square_rad: self.plumb_line_from_square_rad(),
            top_edge_line_from_square_rad: self.top_edge_line_from_square_rad(),
            face_bevel_rad: self.face_bevel_rad(),
            edge_bevel_rad: self.edge_bevel_rad(),
        }
    }

    /// All four angles again, from vectors: the member's faces and the cut
    /// plane are built in 3D, the cut lines are their intersections, and
    /// each bevel is the angle between the cut plane and the unbevelled
    /// blade plane through the same line.
    pub fn by_vectors(&self) -> CutAngles {
        // Member runs along +X in plan and rises at theta: turning about -Y
        // lifts +X towards +Z.
        let member_from_level = DQuat::from_rotation_y(-self.member_pitch_rad);
        let axis = member_from_level * DVec3::X;
        let top_normal = member_from_level * DVec3::Z;
        let side_normal = member_from_level * DVec3::Y;
        // Square lines: across the top face, and up the side face.
        let square_on_top = top_normal.cross(axis);
        let square_on_side = side_normal.cross(axis);
        // The plumb face: its plan trace is the member's plan square line
        // (+Y) turned by gamma about the vertical.
        let trace = DQuat::from_rotation_z(self.plan_angle_rad) * DVec3::Y;
        let cut_normal = trace.cross(DVec3::Z);

        let side_line = cut_normal.cross(side_normal);
        let top_line = cut_normal.cross(top_normal);
        let bevel = |line: DVec3, shoe_normal: DVec3| {
            let unbevelled_normal = line.cross(shoe_normal);
            line_angle(cut_normal, unbevelled_normal)
        };
        CutAngles {
            plumb_line_from_square_rad: line_angle(side_line, square_on_side),
            top_edge_line_from_square_rad: line_angle(top_line, square_on_top),
            face_bevel_rad: bevel(side_line, side_normal),
            edge_bevel_rad: bevel(top_line, top_normal),
        }
    }

    /// Every angle of the cut in degrees, each with its setup in words, in
    /// the order a framer works: mark the lines, then set the saw.
    pub fn settings(&self) -> Vec<AngleSetting> {
        let deg = |rad: f64| rad.to_degrees();
        let plumb = self.plumb_square_figures();
        let mut settings = vec![AngleSetting {
            degrees: deg(self.plumb_line_from_square_rad()),
            setup: format!(
                "plumb line on the side face, {:.1} deg from square (square: 12 and {:.3}, mark \
                 along the {:.3} arm)",
                deg(self.plumb_line_from_square_rad()),
                plumb.figure,
                plumb.figure
            ),
        }];
        let top = self.top_edge_line_from_square_rad();
        let top_setup = match self.top_edge_square_figures() {
            Some(figures) => format!(
                "cheek line across the top edge, {:.1} deg from square (square: 12 and {:.3}, mark \
                 along the 12 arm); a line angle, not a saw bevel",
                deg(top),
                figures.against
            ),
            None => "line across the top edge: square".to_string(),
        };
        settings.push(AngleSetting { degrees: deg(top), setup: top_setup });
        let flat = self.miter_saw_flat();
        let on_edge = self.miter_saw_on_edge();
        settings.extend([
            AngleSetting {
                degrees: deg(self.face_bevel_rad()),
                setup: format!(
                    "circular saw riding the side face along the plumb line: bevel {:.1} deg",
                    deg(self.face_bevel_rad())
                ),
            },
            AngleSetting {
                degrees: deg(self.edge_bevel_rad()),
                setup: format!(
                    "circular saw riding the top edge along the cheek line: bevel {:.1} deg",
                    deg(self.edge_bevel_rad())
                ),
            },
            AngleSetting {
                degrees: deg(flat.miter_rad),
                setup: format!(
                    "miter saw, member flat on its side face: miter {:.1} deg, bevel {:.1} deg",
                    deg(flat.miter_rad),
                    deg(flat.bevel_rad)
                ),
            },
            AngleSetting {
                degrees: deg(on_edge.miter_rad),
                setup: format!(
                    "miter saw, member standing on its top edge: miter {:.1} deg, bevel {:.1} deg",
                    deg(on_edge.miter_rad),
                    deg(on_edge.bevel_rad)
                ),
            },
        ]);
        settings
    }

    /// The bevels a saw tilting at most `max_bevel_rad` cannot make, each
    /// with the other setup to use if it fits.
    pub fn warnings(&self, max_bevel_rad: f64) -> Vec<CutWarning> {
        // A hair of slack so a 45.0 deg cut on a 45 deg saw is not flagged
        // because of float noise in the inputs.
        let limit = max_bevel_rad + 1e-9;
        let face = self.face_bevel_rad();
        let edge = self.edge_bevel_rad();
        let mut warnings = Vec::new();
        if face > limit {
            warnings.push(CutWarning::FaceBevelBeyondSaw {
                bevel_rad: face,
                max_rad: max_bevel_rad,
                edge_bevel_rad: edge,
            });
        }
        if edge > limit {
            warnings.push(CutWarning::EdgeBevelBeyondSaw {
                bevel_rad: edge,
                max_rad: max_bevel_rad,
                face_bevel_rad: face,
            });
        }
        warnings
    }
}

/// The acute angle between two lines given by direction vectors of any
/// length; atan2 keeps full precision near 0 and 90 deg, where acos would not.
fn line_angle(a: DVec3, b: DVec3) -> f64 {
    a.cross(b).length().atan2(a.dot(b).abs())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn square_cut_is_a_plain_plumb_cut() {
        let theta = 0.5f64.atan();
        let cut = CompoundCut::new(theta, 0.0)
            .unwrap_or(CompoundCut { member_pitch_rad: f64::NAN, plan_angle_rad: f64::NAN });
        assert_eq!(cut.top_edge_line_from_square_rad(), 0.0);
        assert_eq!(cut.face_bevel_rad(), 0.0);
        // Saw on the top edge must tilt by the pitch to cut plumb.
        assert!((cut.edge_bevel_rad() - theta).abs() < 1e-12);
        assert!(cut.top_edge_square_figures().is_none());
    }

    #[test]
    fn degenerate_inputs_give_none() {
        assert!(CompoundCut::new(0.3, FRAC_PI_2).is_none());
        assert!(CompoundCut::new(FRAC_PI_2, 0.3).is_none());
        assert!(CompoundCut::new(-0.1, 0.3).is_none());
        assert!(CompoundCut::new(f64::NAN, 0.3).is_none());
        assert!(CompoundCut::new(0.3, f64::INFINITY).is_none());
        assert!(CompoundCut::new(0.3, -0.5).is_some());
    }
}
