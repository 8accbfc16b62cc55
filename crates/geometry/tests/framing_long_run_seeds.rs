//! Outlines from the long random run (`scripts/long-run`) whose frames had
//! a joint that did not fit, written out corner by corner so they stay
//! fixed whatever the generator does. Each test names the seed it came
//! from and checks the joints its fault was in.

mod framing_support;

use framing_support::parry_fit;
use glam::{DVec2, dvec2};
use pitchframe_geometry::framing::{
    Cut, CutEnd, Frame, FramingSettings, FramingWarning, MemberKind, frame_roof,
};
use pitchframe_geometry::{Outline, Roof, RoofLineKind, Wall, WallRoof, check_roof};

/// One wall: its first corner, rise per run (0 for a gable) and overhang.
type WallRow = (f64, f64, f64, f64);

fn walls(rows: &[WallRow]) -> Vec<Wall> {
    rows.iter()
        .map(|&(x, y, slope, overhang_in)| Wall {
            corner: dvec2(x, y),
            roof: if slope > 0.0 { WallRoof::Pitched { rise_per_run: slope } } else { WallRoof::Gable },
            overhang_in,
        })
        .collect()
}

/// Solves, checks and frames an outline with the default settings.
fn framed(outer: &[WallRow], courtyards: &[&[WallRow]]) -> Frame {
    let o = Outline::new(walls(outer), courtyards.iter().map(|c| walls(c)).collect())
        .unwrap_or_else(|e| panic!("outline: {e}"));
    let roof = Roof::solve(&o).unwrap_or_else(|e| panic!("solve: {e}"));
    assert!(check_roof(&o, &roof).is_empty());
    frame_roof(&o, &roof, &FramingSettings::default()).unwrap_or_else(|e| panic!("frame: {e}"))
}

/// 1/64 in, finer than a pencil line (common practice, no source).
const FIT_IN: f64 = 1.0 / 64.0;

/// The piece of `kind` whose plan line's end `end` (0 lower, 1 upper) is
/// within 0.01 in of `point`.
fn piece_ending_at(frame: &Frame, kind: MemberKind, end: usize, point: glam::DVec2) -> Option<usize> {
    frame.pieces.iter().position(|p| p.kind == kind && p.plan_line[end].distance(point) < 0.01)
}

/// Seed 420: a plan round a courtyard, every wall south of the courtyard
/// one plane (walls 18 to 20 in line at 2/12).
#[rustfmt::skip]
const SEED_420: [WallRow; 22] = [
    (0.0, 129.24010090611233, 0.16666666666666666, 15.0),
    (102.82051801573645, 129.24010090611233, 0.4166666666666667, 2.0),
    (102.82051801573645, 101.66264788439055, 0.4166666666666667, 24.0),
    (102.82051801573645, 91.19052414500524, 0.4166666666666667, 24.0),
    (102.82051801573645, 64.62005045305617, 1.3333333333333333, 8.0),
    (205.6410360314729, 64.62005045305617, 1.0833333333333333, 3.0),
    (205.6410360314729, 129.24010090611233, 1.2921928254657005, 8.0),
    (257.46536070357564, 129.24010090611233, 1.2921928254657005, 11.0),
    (308.46155404720935, 129.24010090611233, 1.1074918317864317, 1.0),
    (308.46155404720935, 93.36447493507868, 1.1074918317864317, 21.0),
    (308.46155404720935, 64.62005045305617, 0.4166666666666667, 0.0),
    (411.2820720629458, 64.62005045305617, 0.8333333333333334, 9.0),
    (411.2820720629458, 84.35609553802377, 0.8333333333333334, 8.0),
    (411.2820720629458, 107.95429805578803, 0.8333333333333334, 22.0),
    (411.2820720629458, 129.24010090611233, 0.4166666666666667, 22.0),
    (514.1025900786823, 129.24010090611233, 1.5, 20.0),
    (514.1025900786823, 97.79684089229362, 1.5, 19.0),
    (514.1025900786823, 42.776948726136325, 1.5, 6.0),
    (514.1025900786823, 0.0, 0.16666666666666666, 18.0),
    (406.6642815496633, 0.0, 0.16666666666666666, 20.0),
    (308.46155404720935, 0.0, 0.16666666666666666, 17.0),
    (0.0, 0.0, 1.25, 15.0),
];

// The draw's overhangs 14, 4, 10, 4 in cut to 6, 4, 4, 4 in: as
// drawn the courtyard is too small for them, and refused.
#[rustfmt::skip]
const SEED_420_COURTYARD: [WallRow; 4] = [
    (208.83505446014766, 44.005070361305584, 1.3333333333333333, 6.0),
    (223.80141667112417, 44.005070361305584, 0.6666666666666666, 4.0),
    (223.80141667112417, 33.48140969250558, 0.75, 4.0),
    (208.83505446014766, 33.48140969250558, 0.5604885404795198, 4.0),
];

#[test]
fn no_rake_rafter_on_the_slit_joining_a_courtyard_to_the_outer_ring() {
    let frame = framed(&SEED_420, &[&SEED_420_COURTYARD]);
    // The big south plane runs round the courtyard's roof; its one polygon
    // reaches the courtyard's ring along a slit at x = 193.88 (the west
    // hip end of the courtyard's ridge, y = 50.29, to the ridge at
    // y = 57.44), run once each way. No wall or rake is there: the king
    // common at x = 193.88 is the only rafter near it, and nothing stands
    // half a rafter west of it on the ridge end's extension. Derivation.
    let near_slit: Vec<_> = frame
        .pieces
        .iter()
        .filter(|p| matches!(p.kind, MemberKind::Common | MemberKind::KingCommon))
        .filter(|p| (p.plan_line[0].x - 193.880_389_808_329_5).abs() < 1.5)
        .collect();
    assert_eq!(near_slit.len(), 1, "{:?}", near_slit.iter().map(|p| &p.label).collect::<Vec<_>>());
    assert_eq!(near_slit[0].kind, MemberKind::KingCommon);
    // Every common bears on its ridge within 1/64 in, by the frame's own
    // check and by parry.
    let commons: Vec<_> =
        frame.joints.iter().filter(|j| frame.pieces[j.pieces[0]].kind == MemberKind::Common).collect();
    assert!(!commons.is_empty());
    for j in commons {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        let (gap, overlap, mating) = parry_fit::fit(&frame, j.pieces[0], j.pieces[1]);
        assert!(mating >= 1 && gap < FIT_IN && overlap < FIT_IN, "{:?}: parry {gap} / {overlap}", j.members);
    }
}

/// Seed 168: an E of three wings off a long block, mixed pitches.
#[rustfmt::skip]
const SEED_168: [WallRow; 12] = [
    (0.0, 0.0, 1.1666666666666667, 18.0),
    (1026.0555826891257, 0.0, 1.3333333333333333, 9.0),
    (1026.0555826891257, 347.74668291294574, 0.44683429785504386, 13.0),
    (856.2547258013035, 347.74668291294574, 0.25, 7.0),
    (856.2547258013035, 115.91556097098191, 0.4166666666666667, 18.0),
    (653.2606535063537, 115.91556097098191, 1.0, 7.0),
    (653.2606535063537, 347.74668291294574, 1.4166666666666667, 8.0),
    (456.7416745403087, 347.74668291294574, 0.75, 3.0),
    (456.7416745403087, 115.91556097098191, 1.0833333333333333, 9.0),
    (203.34886064414636, 115.91556097098191, 1.3333333333333333, 17.0),
    (203.34886064414636, 347.74668291294574, 0.25, 14.0),
    (0.0, 347.74668291294574, 0.8333333333333334, 9.0),
];

#[test]
fn an_overlap_is_read_where_the_pieces_meet_not_along_a_far_board() {
    let frame = framed(&SEED_168, &[]);
    // The east wing's valley ends at the block's ridge, beside the end of
    // the wing's own ridge running square to it. The line square to the
    // valley's end from one corner runs the wing ridge's whole 237 in
    // length: the overlap is how deep the corner is in a board, not how
    // far that line runs inside one. The frame's own reading of every
    // joint's overlap is within 1/64 in of parry's contact depth
    // (common practice, no source: the two checks measure one thing).
    for j in &frame.joints {
        let (_, overlap, _) = parry_fit::fit(&frame, j.pieces[0], j.pieces[1]);
        assert!(
            (j.max_overlap - overlap).abs() < FIT_IN,
            "{:?}: own {} in, parry {overlap} in",
            j.members,
            j.max_overlap
        );
    }
}

/// Seed 120: a block whose west side is three walls a hair out of line
/// (x = 0, -0.03, 0), making long roof planes a fraction of an inch wide
/// beside them, with mixed pitches. (The seed made wall 2 a gable 0.36
/// degrees off wall 1's line, which outlines now refuse; here it is
/// pitched as wall 1 is. The west side is as the seed drew it.)
#[rustfmt::skip]
const SEED_120: [WallRow; 12] = [
    (0.0, 64.98620714584081, 0.25, 13.0),
    (174.57897629897877, 64.98620714584081, 0.42001756631087933, 13.0),
    (174.26556088723535, 146.21653709412405, 0.42001756631087933, 22.0),
    (174.57897629897877, 271.31552497099034, 0.16666666666666666, 19.0),
    (276.680828398136, 271.39553426469746, 0.3333333333333333, 18.0),
    (349.15795259795755, 271.31552497099034, 1.0833333333333333, 4.0),
    (349.1359275091018, 320.14349136641636, 1.0833333333333333, 16.0),
    (349.15795259795755, 341.1256683118342, 0.16666666666666666, 15.0),
    (349.15795259795755, 389.9928110536223, 1.5, 12.0),
    (0.0, 389.9928110536223, 0.8333333333333334, 8.0),
    (-0.02786758555291718, 284.7728754783284, 1.0165018664484917, 1.0),
    (0.0, 232.13861942935392, 1.4166666666666667, 17.0),
];

#[test]
fn a_hip_running_low_beside_a_wall_is_cut_level_with_the_plate() {
    let frame = framed(&SEED_120, &[]);
    // The hip from the top of the valley at (0.05, 266.80) runs 201 in
    // south a tenth of an inch inside the west wall, its top under 1/4 in
    // above the plates: its lower edge would go 7 in down into the wall's
    // plate. Where the valley under it is notched over that plate, the
    // hip's cheek met nothing and a gap of 0.44 in was read. Cut level
    // with the top of plate, it bears on the plate and its cheek on the
    // valley above it. Derivation.
    let flagged: Vec<&str> = frame
        .warnings
        .iter()
        .filter_map(|w| match w {
            FramingWarning::HipCutLevelAtPlate { label, cut_in } => {
                assert!(*cut_in > 0.0 && cut_in.is_finite());
                Some(label.as_str())
            }
            _ => None,
        })
        .collect();
    assert!(!flagged.is_empty());
    for p in frame.pieces.iter().filter(|p| flagged.contains(&p.label.as_str())) {
        assert_eq!(p.kind, MemberKind::Hip);
        let lowest = p.solid.vertices().map(|v| v.z).fold(f64::INFINITY, f64::min);
        assert!(lowest > -1e-6, "{} reaches {lowest} in below the plates' top", p.label);
        // The level cut is in the member's cut list, as long as the
        // solid's face on the plates' top and as deep as the warning says.
        let member = frame.members.iter().find(|m| m.label == p.label).unwrap();
        let level: Vec<(f64, f64)> = member
            .cuts
            .iter()
            .filter_map(|c| match c {
                Cut::PlateLevel { length_in, depth_off_in, .. } => Some((*length_in, *depth_off_in)),
                _ => None,
            })
            .collect();
        assert_eq!(level.len(), 1, "{}: {:?}", p.label, member.cuts);
        let dir = (p.plan_line[1] - p.plan_line[0]).normalize();
        let on_plate: Vec<f64> =
            p.solid.vertices().filter(|v| v.z.abs() < 1e-6).map(|v| v.truncate().dot(dir)).collect();
        let extent = on_plate.iter().copied().fold(f64::NEG_INFINITY, f64::max)
            - on_plate.iter().copied().fold(f64::INFINITY, f64::min);
        assert!((level[0].0 - extent).abs() < 1e-6 && level[0].0 > 1.0, "{level:?} against {extent}");
        let warned = frame.warnings.iter().find_map(|w| match w {
            FramingWarning::HipCutLevelAtPlate { label, cut_in } if *label == p.label => Some(*cut_in),
            _ => None,
        });
        assert_eq!(warned, Some(level[0].1));
    }
    let foot = dvec2(0.046_612_367, 266.796_437_859);
    let on_valley: Vec<_> = frame
        .joints
        .iter()
        .filter(|j| frame.pieces[j.pieces[0]].kind == MemberKind::Hip)
        .filter(|j| frame.pieces[j.pieces[1]].kind == MemberKind::Valley)
        .filter(|j| frame.pieces[j.pieces[0]].plan_line[0].distance(foot) < 1e-6)
        .collect();
    assert_eq!(on_valley.len(), 1);
    assert!(flagged.contains(&frame.pieces[on_valley[0].pieces[0]].label.as_str()));
    for j in on_valley {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        // The valley's half on the wall's side is a wedge under 0.05 in
        // wide that parry cannot hull; the hip must hull.
        if parry_fit::measurable(&frame, j.pieces[0], j.pieces[1]) {
            let (gap, overlap, mating) = parry_fit::fit(&frame, j.pieces[0], j.pieces[1]);
            assert!(
                mating >= 1 && gap < FIT_IN && overlap < FIT_IN,
                "{:?}: parry {gap} / {overlap}",
                j.members
            );
        } else {
            assert!(parry_fit::measurable(&frame, j.pieces[0], j.pieces[0]));
        }
    }
}

/// Seed 108: a 1052 in x 160 in block, all 18/12, with two wings north,
/// the east one 160.79 in wide, a hair wider than the block is deep.
#[rustfmt::skip]
const SEED_108: [WallRow; 10] = [
    (0.0, 329.9923658103066, 1.5, 14.0),
    (208.75188655617586, 329.9923658103066, 1.5, 0.0),
    (208.75188655617586, 159.9747539450657, 1.5, 3.0),
    (435.84455154429884, 159.9747539450657, 1.5, 12.0),
    (435.84455154429884, 329.9923658103066, 1.5, 18.0),
    (596.6357708291057, 329.9923658103066, 1.5, 18.0),
    (596.6357708291057, 159.9747539450657, 1.5, 14.0),
    (1052.017944010221, 159.9747539450657, 1.5, 16.0),
    (1052.017944010221, 0.0, 1.5, 17.0),
    (0.0, 0.0, 1.5, 12.0),
];

#[test]
fn a_hip_shorter_than_its_thickness_is_left_out_and_flagged() {
    let frame = framed(&SEED_108, &[]);
    // The east wing (160.79 in wide) stands 0.61 in above the block's
    // ridge (159.97 in deep), both at 18/12. Its valleys reach the
    // block's ridge 160.79 - 159.97 = 0.82 in apart, and from each a hip
    // rises at 45 degrees in plan to the wing ridge's end, 0.41 in each
    // way: a plan run of 0.41 x sqrt 2 = 0.58 in, under the hip's 1-1/2
    // in thickness (default settings). Derivation.
    let hip_t = FramingSettings::default().hip.thickness_in;
    for p in frame.pieces.iter().filter(|p| matches!(p.kind, MemberKind::Hip | MemberKind::Valley)) {
        let run = p.plan_line[0].distance(p.plan_line[1]);
        assert!(run >= hip_t, "{} is {run} in long in plan", p.label);
    }
    let left_out: Vec<f64> = frame
        .warnings
        .iter()
        .filter_map(|w| match w {
            FramingWarning::ShortMemberLeftOut { left_out: MemberKind::Hip, length_in, .. } => {
                Some(*length_in)
            }
            _ => None,
        })
        .collect();
    assert!(!left_out.is_empty());
    for length_in in left_out {
        assert!((length_in - 0.408 * 2f64.sqrt()).abs() < 0.01, "{length_in}");
    }
}

/// Seed 366: a U of two wings round a courtyard, mixed pitches; walls 0,
/// 1 and 6 are gables.
#[rustfmt::skip]
const SEED_366: [WallRow; 12] = [
    (0.0, 443.34279055581635, 0.0, 1.0),
    (728.941760571645, 443.34279055581635, 0.0, 15.0),
    (728.941760571645, 295.56186037054425, 1.3333333333333333, 10.0),
    (862.6425353964869, 295.56186037054425, 0.9166666666666666, 12.0),
    (862.6425353964869, 147.78093018527213, 1.4166666666666667, 7.0),
    (728.941760571645, 147.78093018527213, 0.9166666666666666, 3.0),
    (728.941760571645, 0.0, 0.0, 3.0),
    (488.1923131578649, 0.0, 0.8333333333333334, 15.0),
    (488.1923131578649, 147.78093018527213, 1.0833333333333333, 12.0),
    (266.52961295504315, 147.78093018527213, 1.1127127425365986, 8.0),
    (266.52961295504315, 0.0, 0.8333333333333334, 20.0),
    (0.0, 0.0, 0.5, 3.0),
];

#[rustfmt::skip]
const SEED_366_COURTYARD: [WallRow; 4] = [
    (409.0433800107727, 164.4437467055757, 1.25, 7.0),
    (459.18983895684676, 164.4437467055757, 1.1666666666666667, 10.0),
    (459.18983895684676, 223.08244086650714, 0.8333333333333334, 3.0),
    (409.0433800107727, 223.08244086650714, 0.16666666666666666, 15.0),
];

#[test]
fn a_hip_with_a_king_on_one_side_only_is_cut_to_the_ridge_beside_it() {
    let frame = framed(&SEED_366, &[&SEED_366_COURTYARD]);
    // The hip between wall 8's plane and the courtyard's west wall's plane
    // rises west from (351.02, 156.71) to the node (241.42, 173.57), where
    // the ridge between wall 9's plane and the courtyard's west plane runs
    // south along x = 241.42 and the valley between walls 8 and 9 also
    // ends. Only the courtyard's side has a king there (along y = 173.57,
    // on the ridge's east face); wall 8's side has the valley instead.
    // Cut to the king alone, the hip's top ran 0.69 in past the ridge's
    // east face (x = 241.42 + 3/4 in) into the ridge. Its top must bear on
    // the king and on that face, with no corner west of it. Derivation.
    let node = dvec2(241.423, 173.569);
    let hip = frame
        .pieces
        .iter()
        .position(|p| {
            p.kind == MemberKind::Hip
                && p.plan_line[1].distance(node) < 0.01
                && p.plan_line[0].distance(dvec2(351.021, 156.707)) < 0.01
        })
        .expect("the hip rising west to the node");
    let ridge_face_x = 241.422_702_08 + FramingSettings::default().ridge.thickness_in / 2.0;
    let westmost = frame.pieces[hip].solid.vertices().map(|v| v.x).fold(f64::INFINITY, f64::min);
    assert!(
        westmost > ridge_face_x - 1e-6,
        "hip reaches x = {westmost}, the ridge's face is at {ridge_face_x}"
    );
    let mut bears_on = Vec::new();
    for j in frame.joints.iter().filter(|j| j.pieces[0] == hip) {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        let kind = frame.pieces[j.pieces[1]].kind;
        bears_on.push(kind);
        // The top's two joints, by parry too. (The foot's cheek on the
        // valley there is another case: parry reads 0.016 in of gap.)
        let at_top = frame.pieces[j.pieces[1]].plan_line.iter().any(|p| (p.x - 241.422_702_08).abs() < 1e-6);
        if kind == MemberKind::KingCommon || (kind == MemberKind::Ridge && at_top) {
            let (gap, overlap, mating) = parry_fit::fit(&frame, j.pieces[0], j.pieces[1]);
            assert!(
                mating >= 1 && gap < FIT_IN && overlap < FIT_IN,
                "{:?}: parry {gap} / {overlap}",
                j.members
            );
        }
    }
    assert!(bears_on.contains(&MemberKind::KingCommon), "{bears_on:?}");
    assert_eq!(bears_on.iter().filter(|k| **k == MemberKind::Ridge).count(), 2, "{bears_on:?}");
}

/// Seed 382: a block with a gable wing west and a square courtyard, all
/// 7/12 but the courtyard's walls (0.88 rise per run).
#[rustfmt::skip]
const SEED_382: [WallRow; 8] = [
    (0.0, 240.6202215026111, 0.5833333333333334, 10.0),
    (127.69953793002426, 240.6202215026111, 0.5833333333333334, 22.0),
    (127.69953793002426, 360.9303322539166, 0.0, 2.0),
    (0.0, 360.9303322539166, 0.5833333333333334, 7.0),
    (0.0, 481.2404430052222, 0.0, 11.0),
    (358.0678629668596, 481.2404430052222, 0.5833333333333334, 4.0),
    (358.0678629668596, 0.0, 0.5833333333333334, 22.0),
    (0.0, 0.0, 0.5833333333333334, 20.0),
];

// The draw's overhangs 20, 3, 5, 15 in cut to 12, 3, 5, 15 in: as
// drawn the courtyard is too small for them, and refused.
#[rustfmt::skip]
const SEED_382_COURTYARD: [WallRow; 4] = [
    (157.64228958781342, 349.62562416470627, 0.8796394681680416, 12.0),
    (182.5626571556893, 349.62562416470627, 0.8796394681680416, 3.0),
    (182.5626571556893, 331.9022156189557, 0.8796394681680416, 5.0),
    (157.64228958781342, 331.9022156189557, 0.8796394681680416, 15.0),
];

#[test]
fn a_ridge_ending_beside_a_valley_is_cut_back_to_the_valley() {
    let frame = framed(&SEED_382, &[&SEED_382_COURTYARD]);
    // The valley from the courtyard's north-west corner (157.64, 349.63)
    // runs at 45 degrees in plan (equal pitches either side) north-west;
    // the ridge along x = 145.70 ends at (145.70, 360.93), whose distance
    // from the valley's centre line is |(-11.94) + 11.30| / sqrt 2 = 0.45
    // in, inside the valley's 3/4 in half thickness: the ridge's square
    // end ran into the valley, its east corner 0.08 in from the valley's
    // centre line. It is cut back to the valley's side and bears on it.
    // Derivation.
    let corner = dvec2(157.642_289_587_813_42, 349.625_624_164_706_27);
    let half = FramingSettings::default().valley.thickness_in / 2.0;
    let ridge = frame
        .pieces
        .iter()
        .position(|p| {
            p.kind == MemberKind::Ridge
                && p.plan_line.iter().all(|q| (q.x - 145.703).abs() < 0.01)
                && p.plan_line.iter().any(|q| (q.y - 360.93).abs() < 0.01)
        })
        .expect("the ridge along x = 145.70");
    for v in frame.pieces[ridge].solid.vertices() {
        let off = ((v.x - corner.x) + (v.y - corner.y)).abs() / 2f64.sqrt();
        assert!(off > half - 1e-6, "ridge corner {v} is {off} in from the valley's centre line");
    }
    let on_valley: Vec<_> = frame
        .joints
        .iter()
        .filter(|j| j.pieces[0] == ridge && frame.pieces[j.pieces[1]].kind == MemberKind::Valley)
        .collect();
    assert_eq!(on_valley.len(), 1);
    for j in on_valley.iter().copied().chain(frame.joints.iter().filter(|j| j.pieces[1] == ridge)) {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
    }
    let (gap, overlap, mating) = parry_fit::fit(&frame, ridge, on_valley[0].pieces[1]);
    assert!(mating >= 1 && gap < FIT_IN && overlap < FIT_IN, "parry {gap} / {overlap}");
}

/// Seed 448: a long block with a small wing on its east end, walls 3 to
/// 9 round the wing, mixed pitches.
#[rustfmt::skip]
const SEED_448: [WallRow; 13] = [
    (0.0, 0.0, 0.8333333333333334, 9.0),
    (95.04271605009401, 0.0, 0.8333333333333334, 20.0),
    (200.74287856228386, 0.0, 0.8333333333333334, 1.0),
    (467.73117498782403, 0.0, 0.25, 24.0),
    (467.73117498782403, 35.22566518466822, 0.25, 8.0),
    (467.73117498782403, 77.51295386485174, 0.8099478919722647, 7.0),
    (413.29388531571436, 77.51295386485174, 1.4166666666666667, 14.0),
    (413.29388531571436, 125.29523410336876, 0.5833333333333334, 6.0),
    (443.3485254311736, 125.29523410336876, 0.5833333333333334, 5.0),
    (467.73117498782403, 125.29523410336876, 0.16666666666666666, 8.0),
    (467.73117498782403, 461.2688701180438, 0.5, 2.0),
    (0.0, 461.2688701180438, 0.6666666666666666, 15.0),
    (0.0, 390.56301286400253, 0.6666666666666666, 23.0),
];

#[test]
fn a_valley_starting_up_on_the_roof_ends_at_its_foot() {
    let frame = framed(&SEED_448, &[]);
    // The valley between walls 0 and 5's planes starts at (406.04, 64.82),
    // 10.3 in up, where the valley from the inside corner (413.29, 77.51)
    // and the ridge along x = 406.04 end, and runs west-south-west to the
    // ridge at y = 38.20. It has no seat: it was framed as if over a
    // corner, running on past its foot through the ridge's end and the
    // other valley down to x = 505 in. Its foot is now cut to the ridge's
    // square end through the node (y = 64.82), the plane square to the
    // ridge: the valley's far edge, 3/4 in off its centre line at
    // atan(26.61 / 129.33) = 11.6 degrees to that plane, crosses it
    // 0.75 / tan(11.6 deg) = 3.64 in back along the valley. Derivation.
    let foot = dvec2(406.036, 64.818);
    let top = dvec2(276.706, 38.205);
    let up = (top - foot).normalize();
    let valley =
        piece_ending_at(&frame, MemberKind::Valley, 0, foot).expect("the valley starting at (406.04, 64.82)");
    let back = frame.pieces[valley]
        .solid
        .vertices()
        .map(|v| (v.truncate() - foot).dot(up))
        .fold(f64::INFINITY, f64::min);
    assert!(back > -3.65, "the valley runs {} in past its foot", -back);
    let on_ridge: Vec<_> = frame
        .joints
        .iter()
        .filter(|j| j.pieces[0] == valley && frame.pieces[j.pieces[1]].kind == MemberKind::Ridge)
        .collect();
    assert_eq!(on_ridge.len(), 2, "the foot and the top each bear on a ridge");
    for j in on_ridge {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
    }
}

/// Seed 14396: a long block whose north walls are a hair out of line,
/// with a courtyard, mixed pitches.
#[rustfmt::skip]
const SEED_14396: [WallRow; 10] = [
    (0.0, 0.0, 0.6666666666666666, 3.0),
    (416.7000281707565, 0.0, 0.16666666666666666, 7.0),
    (416.7000281707565, 127.00789338448286, 1.1666666666666667, 14.0),
    (379.63789587385213, 127.0732128006649, 0.75, 11.0),
    (352.92915735559393, 127.00789338448286, 1.0, 13.0),
    (324.8714902263165, 127.10446953676988, 0.16666666666666666, 20.0),
    (298.63078269042336, 127.00789338448286, 0.934610673042, 18.0),
    (240.16477929253116, 127.00789338448286, 0.5833333333333334, 14.0),
    (93.70955161054103, 126.72228627040664, 0.25, 19.0),
    (0.0, 127.00789338448286, 0.8333333333333334, 19.0),
];

#[rustfmt::skip]
const SEED_14396_COURTYARD: [WallRow; 4] = [
    (174.05117151453283, 11.996553292943858, 1.4166666666666667, 18.0),
    (199.5958737392342, 11.996553292943858, 1.0, 2.0),
    (199.5958737392342, 43.366565126019644, 0.7525664509664406, 4.0),
    (174.05117151453283, 43.366565126019644, 0.75, 22.0),
];

#[test]
fn a_ridge_ending_near_a_hips_top_is_not_cut_back_to_its_side() {
    let frame = framed(&SEED_14396, &[&SEED_14396_COURTYARD]);
    // The ridge along x = 230.61 ends at (230.61, 84.58); a hip 1.78 in
    // long in plan rises from there to (228.87, 84.96), where the long hip
    // from the east wall ends. The ridge end's west corner (229.86, 84.58)
    // is 1.06 in from that hip's top, inside its 1-1/2 in thickness of
    // its end, where the hip is cut to what it meets: not beside its
    // length. Cut back to the hip's side there, the ridge end stood off
    // the hip by 0.56 in. It keeps its end, and every joint at it fits.
    // Derivation.
    let ridge = frame
        .pieces
        .iter()
        .position(|p| {
            p.kind == MemberKind::Ridge
                && p.plan_line.iter().all(|q| (q.x - 230.611).abs() < 0.01)
                && p.plan_line.iter().any(|q| (q.y - 84.579).abs() < 0.01)
        })
        .expect("the ridge along x = 230.61");
    let at_ridge: Vec<_> = frame.joints.iter().filter(|j| j.pieces.contains(&ridge)).collect();
    assert!(!at_ridge.is_empty());
    for j in at_ridge {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
    }
    assert!(
        !frame
            .joints
            .iter()
            .any(|j| j.pieces[0] == ridge && frame.pieces[j.pieces[1]].kind == MemberKind::Hip),
        "the ridge's end is cut to a hip"
    );
}

#[test]
fn ridges_meeting_across_a_left_out_hip_are_cut_to_each_other() {
    let frame = framed(&SEED_168, &[]);
    // A hip 0.65 in long in plan, too short to cut, runs from (998.61,
    // 30.50), where the ridge along y = 30.50 and the valley from the
    // inside corner (856.26, 115.92) end, to (999.25, 30.64), where the
    // ridge along x = 999.25 and the hip from the corner (1026.06, 0) end.
    // That second node is a hip end: its ridge runs on 3/4 in past it
    // and the king common along x = 999.25 bears on its end. The first
    // ridge's square end ran 0.11 in past the second ridge's west face
    // (999.245 - 3/4 = 998.495 in), into that ridge and the king; the
    // valley's top ran into the second ridge beside it. Were the short hip
    // not there, both ridges would meet at one node and the first would
    // butt against the second's side: it is cut back to that face and
    // bears on it, and the valley's top is cut to it too. Derivation.
    let ridge_face_x = 999.245_001 - FramingSettings::default().ridge.thickness_in / 2.0;
    let first = frame
        .pieces
        .iter()
        .position(|p| {
            p.kind == MemberKind::Ridge
                && p.plan_line.iter().any(|q| q.distance(dvec2(998.607, 30.504)) < 0.01)
        })
        .expect("the ridge ending at (998.61, 30.50)");
    let eastmost = frame.pieces[first].solid.vertices().map(|v| v.x).fold(f64::NEG_INFINITY, f64::max);
    assert!(
        (eastmost - ridge_face_x).abs() < 0.01,
        "the ridge reaches x = {eastmost}, the face is at {ridge_face_x}"
    );
    let second = frame
        .pieces
        .iter()
        .position(|p| p.kind == MemberKind::Ridge && p.plan_line.iter().all(|q| (q.x - 999.245).abs() < 0.01))
        .expect("the ridge along x = 999.25");
    assert!(frame.joints.iter().any(|j| j.pieces == [first, second]), "the first ridge bears on the second");
    // Every joint of the pieces at the two nodes fits within 1/64 in, by
    // the frame's own check and by parry.
    let at_nodes = |i: usize| {
        frame.pieces[i]
            .plan_line
            .iter()
            .any(|q| q.distance(dvec2(998.607, 30.504)) < 1.0 || q.distance(dvec2(999.245, 30.641)) < 1.0)
    };
    let joints: Vec<_> = frame.joints.iter().filter(|j| at_nodes(j.pieces[0])).collect();
    let kinds: Vec<MemberKind> = joints.iter().map(|j| frame.pieces[j.pieces[0]].kind).collect();
    for kind in [MemberKind::Ridge, MemberKind::KingCommon, MemberKind::Valley] {
        assert!(kinds.contains(&kind), "{kinds:?}");
    }
    for j in joints {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        let (gap, overlap, mating) = parry_fit::fit(&frame, j.pieces[0], j.pieces[1]);
        assert!(mating >= 1 && gap < FIT_IN && overlap < FIT_IN, "{:?}: parry {gap} / {overlap}", j.members);
    }
}

/// Seed 44494: a long block with two wings and a courtyard, mixed
/// pitches, walls 11, 14 and 20 gables.
#[rustfmt::skip]
const SEED_44494: [WallRow; 23] = [
    (0.0, 0.01586331455067062, 0.5, 18.0),
    (0.01586331455067062, 0.0, 0.6934422384434443, 13.0),
    (352.49722247667813, 0.0, 0.6934422384434443, 8.0),
    (352.5172606770331, 0.0, 0.6934422384434443, 12.0),
    (705.0144831537112, 0.0, 0.6934422384434443, 2.0),
    (881.2681039421391, 0.0, 0.6934422384434443, 23.0),
    (1057.5217247305668, 0.0, 1.0833333333333333, 5.0),
    (1057.5217247305668, 140.033383397598, 0.4518360570907635, 16.0),
    (983.5116798664656, 140.033383397598, 0.4518360570907635, 19.0),
    (881.2681039421391, 140.033383397598, 1.1301961809014613, 18.0),
    (881.2681039421391, 700.1669169879899, 1.4166666666666667, 18.0),
    (705.0333771538145, 700.1669169879899, 0.0, 20.0),
    (705.0144831537112, 700.1480229878866, 1.0833333333333333, 13.0),
    (705.0144831537112, 280.066766795196, 1.0833333333333333, 1.0),
    (705.0144831537112, 140.033383397598, 0.0, 16.0),
    (528.7608623652834, 140.033383397598, 0.5, 17.0),
    (528.7608623652834, 420.100150192794, 0.8333333333333334, 19.0),
    (352.5072415768556, 420.100150192794, 1.0, 18.0),
    (352.5072415768556, 140.033383397598, 1.4166666666666667, 18.0),
    (176.2536207884278, 140.033383397598, 1.0833333333333333, 10.0),
    (176.2536207884278, 280.0530071310392, 0.0, 19.0),
    (176.239861124271, 280.066766795196, 1.1666666666666667, 16.0),
    (0.0, 280.066766795196, 0.5833333333333334, 23.0),
];

#[rustfmt::skip]
const SEED_44494_COURTYARD: [WallRow; 4] = [
    (424.6884324121936, 145.18867368323563, 0.16666666666666666, 17.0),
    (521.7148247939859, 145.18867368323563, 1.4166666666666667, 18.0),
    (521.7148247939859, 242.9528254507184, 1.0833333333333333, 20.0),
    (424.6884324121936, 242.9528254507184, 1.5, 4.0),
];

#[test]
fn a_ridge_running_low_over_a_plate_is_cut_level_with_it() {
    let frame = framed(&SEED_44494, &[&SEED_44494_COURTYARD]);
    // The ridge along x = 523.55 between wall 15's plane (x = 528.76,
    // 6/12) and the courtyard's east wall's plane (x = 521.71, 17/12) is
    // only 2.60 in above the plates: 1.84 in from the courtyard's wall
    // line, it stands over that wall's plate, and a 2x10 ridge's 9-1/4 in
    // reaches 1.36 in below the plates' top. Its south end is cut back to
    // the side of the valley rising from the courtyard's corner (521.71,
    // 145.19), 2.8 to 5.2 in from that corner, partly over the plate of
    // the courtyard's south wall, where the valley is notched down to the
    // plate's top: the ridge's end below the plate faced nothing, a gap
    // of 3/4 in. Cut level with the plate's top, as a hip
    // running as low is, it bears on the plate and its end on the valley
    // above it. Derivation.
    let ridge = frame
        .pieces
        .iter()
        .position(|p| p.kind == MemberKind::Ridge && p.plan_line.iter().all(|q| (q.x - 523.553).abs() < 0.01))
        .expect("the ridge along x = 523.55");
    let label = &frame.pieces[ridge].label;
    let lowest = frame.pieces[ridge].solid.vertices().map(|v| v.z).fold(f64::INFINITY, f64::min);
    assert!(lowest > -1e-6, "{label} reaches {lowest} in below the plates' top");
    let flagged = frame.warnings.iter().any(|w| {
        matches!(w, FramingWarning::HipCutLevelAtPlate { label: l, cut_in } if l == label && (cut_in - 1.357).abs() < 0.01)
    });
    assert!(flagged, "{label} is not flagged cut level at the plate: {:?}", frame.warnings);
    let member = frame.members.iter().find(|m| &m.label == label).unwrap();
    assert!(member.cuts.iter().any(|c| matches!(c, Cut::PlateLevel { .. })), "{:?}", member.cuts);
    let on_valley: Vec<_> = frame
        .joints
        .iter()
        .filter(|j| j.pieces[0] == ridge && frame.pieces[j.pieces[1]].kind == MemberKind::Valley)
        .collect();
    assert_eq!(on_valley.len(), 1);
    // Its joint on the valley and every rafter's on it fit within 1/64
    // in, by the frame's own check; the valley joint's overlap by parry
    // too. (Parry's gap casts from every end face of the ridge: the square
    // end beside the cheek bears on nothing and stands 0.10 in off the
    // valley's side.)
    for j in on_valley.iter().copied().chain(frame.joints.iter().filter(|j| j.pieces[1] == ridge)) {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
    }
    let (_, overlap, mating) = parry_fit::fit(&frame, ridge, on_valley[0].pieces[1]);
    assert!(mating >= 1 && overlap < FIT_IN, "parry overlap {overlap}");
}

/// Seed 802: a block with a wing north, mixed pitches.
#[rustfmt::skip]
const SEED_802: [WallRow; 8] = [
    (0.0, 0.0, 0.7918483700027051, 3.0),
    (400.1383069917886, 0.0, 0.16666666666666666, 23.0),
    (400.1383069917886, 422.1505198457505, 0.3333333333333333, 13.0),
    (266.7588713278591, 422.1505198457505, 0.25, 3.0),
    (266.7588713278591, 624.5703976443671, 1.4166666666666667, 11.0),
    (133.37943566392954, 624.5703976443671, 0.8789636669510356, 10.0),
    (133.37943566392954, 422.1505198457505, 0.75, 15.0),
    (0.0, 422.1505198457505, 0.16666666666666666, 20.0),
];

#[test]
fn a_hip_of_a_few_inches_between_two_ridge_ends_is_left_out_and_flagged() {
    let frame = framed(&SEED_802, &[]);
    // The wing's ridge along x = 162.915 (3/12 and 9/12 either side) ends
    // at (162.915, 387.536), where the valley from the wing's west inside
    // corner (133.38, 422.15) ends too; the block's ridge along x =
    // 160.055 starts at (160.055, 386.583), where the hip from the corner
    // (0, 422.15) ends. The ridge steps 2.86 in sideways and 0.72 in up,
    // and a hip of hypot(2.860, 0.953) = 3.01 in plan runs between the two
    // ends, under a 2x10 hip's 9-1/4 in depth: cut to the first ridge's
    // end at its foot and to the king and ridge at its top, its foot's
    // face looked along the other ridge, and was read as overlapping it
    // by 45 in. It is left out for a fitted block, the members meeting it
    // flagged, and every joint at the two nodes fits. Derivation.
    let (p, q) = (dvec2(162.915, 387.536), dvec2(160.055, 386.583));
    let near = |a: glam::DVec2, b: glam::DVec2| a.distance(b) < 0.01;
    assert!(
        !frame.pieces.iter().any(|piece| piece.kind == MemberKind::Hip
            && piece.plan_line.iter().any(|e| near(*e, p))
            && piece.plan_line.iter().any(|e| near(*e, q))),
        "the short hip is cut"
    );
    let flagged: Vec<&str> = frame
        .warnings
        .iter()
        .filter_map(|w| match w {
            FramingWarning::ShortMemberLeftOut { label, left_out: MemberKind::Hip, length_in } => {
                assert!((length_in - 3.0146).abs() < 0.001, "{length_in}");
                Some(label.as_str())
            }
            _ => None,
        })
        .collect();
    let flagged_kinds: Vec<MemberKind> = frame
        .pieces
        .iter()
        .filter(|piece| flagged.contains(&piece.label.as_str()))
        .map(|piece| piece.kind)
        .collect();
    assert!(
        flagged_kinds.contains(&MemberKind::Ridge) && flagged_kinds.contains(&MemberKind::Valley),
        "{flagged:?}"
    );
    // Every joint of a piece ending within a foot of either node fits
    // within 1/64 in, by the frame's own check and by parry.
    let at_nodes =
        |i: usize| frame.pieces[i].plan_line.iter().any(|e| e.distance(p) < 12.0 || e.distance(q) < 12.0);
    let joints: Vec<_> = frame.joints.iter().filter(|j| at_nodes(j.pieces[0])).collect();
    assert!(joints.len() >= 3, "{joints:?}");
    for j in joints {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        let (gap, overlap, mating) = parry_fit::fit(&frame, j.pieces[0], j.pieces[1]);
        assert!(mating >= 1 && gap < FIT_IN && overlap < FIT_IN, "{:?}: parry {gap} / {overlap}", j.members);
    }
}

/// Seed 17954: a block with wings, mixed pitches.
#[rustfmt::skip]
const SEED_17954: [WallRow; 10] = [
    (0.0, 152.63269294799187, 1.0975321779937868, 12.0),
    (276.5093405478862, 152.63269294799187, 0.4166666666666667, 15.0),
    (276.5093405478862, 228.9490394219878, 1.0, 19.0),
    (469.2187041065037, 228.9490394219878, 1.221652264269619, 10.0),
    (469.2187041065037, 305.26538589598374, 1.221652264269619, 14.0),
    (469.2187041065037, 381.5817323699797, 0.6666666666666666, 15.0),
    (744.6376001321535, 381.5817323699797, 1.5, 14.0),
    (744.6376001321535, 457.89807884397567, 0.3333333333333333, 1.0),
    (276.5093405478862, 457.89807884397567, 0.3333333333333333, 15.0),
    (0.0, 457.89807884397567, 0.4166666666666667, 2.0),
];

#[test]
fn a_corner_on_the_side_of_a_board_its_line_runs_along_is_no_overlap() {
    let frame = framed(&SEED_17954, &[]);
    // The valley from (276.51, 228.95) ends at (139.14, 286.19), where the
    // ridge along y = 286.19 ends; a hip 1.42 in long, too short to cut,
    // runs from there to (138.26, 285.08), where the ridge along x =
    // 138.26 starts. The valley's top is cut to the first ridge's side and
    // to the second's east face (x = 138.255 + 3/4 = 139.005). A corner of
    // its cheek on the second ridge lies on the first ridge's south face
    // (y = 286.186 - 3/4 = 285.436), and the line square to the cheek
    // from there runs along that face for the first ridge's whole 284 in:
    // it was read as the valley passing through that board, an overlap of
    // 284 in, where the boards only touch. Every joint at the node fits
    // within 1/64 in by the frame's own check, and its overlap is parry's
    // contact depth within 1/64 in (the two checks measure one thing).
    // Derivation.
    let node = dvec2(139.140, 286.186);
    let valley =
        piece_ending_at(&frame, MemberKind::Valley, 1, node).expect("the valley ending at (139.14, 286.19)");
    let on_ridges: Vec<_> = frame
        .joints
        .iter()
        .filter(|j| j.pieces[0] == valley && frame.pieces[j.pieces[1]].kind == MemberKind::Ridge)
        .collect();
    assert_eq!(on_ridges.len(), 2, "{on_ridges:?}");
    for j in on_ridges {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        let (_, overlap, mating) = parry_fit::fit(&frame, j.pieces[0], j.pieces[1]);
        assert!(mating >= 1 && (j.max_overlap - overlap).abs() < FIT_IN, "{:?}: parry {overlap}", j.members);
    }
}

/// Seed 38: a block with two wings north, every wall 8/12.
#[rustfmt::skip]
const SEED_38: [WallRow; 12] = [
    (0.0, 0.0, 0.6666666666666666, 13.0),
    (603.1978048994264, 0.0, 0.6666666666666666, 16.0),
    (603.1978048994264, 96.31344341668854, 0.6666666666666666, 2.0),
    (454.16812824515915, 96.31344341668854, 0.6666666666666666, 14.0),
    (454.16812824515915, 416.29219332771777, 0.6666666666666666, 12.0),
    (405.8687966655539, 416.29219332771777, 0.6666666666666666, 13.0),
    (405.79382552970014, 263.4127625932426, 0.6666666666666666, 8.0),
    (405.8687966655539, 96.31344341668854, 0.6666666666666666, 14.0),
    (324.15353950381257, 96.15455731743667, 0.6666666666666666, 19.0),
    (246.92178147982983, 96.31344341668854, 0.6666666666666666, 19.0),
    (246.92178147982983, 416.29219332771777, 0.6666666666666666, 17.0),
    (0.0, 416.29219332771777, 0.6666666666666666, 24.0),
];

#[test]
fn a_hip_on_the_kings_of_a_ridge_a_hair_off_square_fits() {
    let frame = framed(&SEED_38, &[]);
    // The ridge from the east hip end (555.041, 48.1567) runs west to
    // (406.011, 48.1568): its ends 6.2e-5 in apart across, 4.2e-7 rad off
    // the x axis, where the walls are square. Each king at that hip end is
    // cut to the ridge's end or side as the ridge lies; each hip's top
    // cheek is cut to the side of a king, square to the walls. The corner
    // of the cheek at the hip's top is 3e-7 in (0.75 in x 4.2e-7) off the
    // king's top cut, and the joint check read it along the cheek's normal
    // as a gap of 0.75 in, to where the two planes cross over the king's
    // centre line. Every hip on a king fits within 1/64 in, by the frame's
    // own check and by parry. Derivation.
    let node = dvec2(555.041_083_191, 48.156_721_708);
    let at_node: Vec<_> = frame
        .joints
        .iter()
        .filter(|j| {
            frame.pieces[j.pieces[0]].kind == MemberKind::Hip
                && frame.pieces[j.pieces[1]].kind == MemberKind::KingCommon
                && frame.pieces[j.pieces[0]].plan_line[1].distance(node) < 1e-6
        })
        .collect();
    assert_eq!(at_node.len(), 4, "two hips, each on two kings");
    for j in at_node {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        let (gap, overlap, mating) = parry_fit::fit(&frame, j.pieces[0], j.pieces[1]);
        assert!(mating >= 1 && gap < FIT_IN && overlap < FIT_IN, "{:?}: parry {gap} / {overlap}", j.members);
    }
}

/// Seed 22164: a block with a wing east and a courtyard, mixed pitches.
#[rustfmt::skip]
const SEED_22164: [WallRow; 11] = [
    (0.0, 612.9236208871946, 0.7000787951044956, 15.0),
    (275.2780575905974, 612.9236208871946, 1.3333333333333333, 20.0),
    (275.2780575905974, 474.8868435123052, 0.16666666666666666, 3.0),
    (381.4425303527952, 474.8868435123052, 1.3333333333333333, 3.0),
    (381.4425303527952, 423.86752236857757, 1.3333333333333333, 17.0),
    (381.4425303527952, 372.9151001254634, 0.6666666666666666, 7.0),
    (275.2780575905974, 372.9151001254634, 1.4166666666666667, 6.0),
    (275.2780575905974, 154.0348776872974, 1.4166666666666667, 4.0),
    (275.2780575905974, 0.0, 1.1073209011303269, 4.0),
    (192.55000359940846, 0.0, 1.1073209011303269, 13.0),
    (0.0, 0.0, 0.4166666666666667, 7.0),
];

#[rustfmt::skip]
const SEED_22164_COURTYARD: [WallRow; 4] = [
    (127.88563487352666, 253.5165200004261, 0.75, 9.0),
    (168.61515941901965, 253.5165200004261, 0.3961447933733959, 17.0),
    (168.61515941901965, 290.7989566379839, 1.0833333333333333, 14.0),
    (127.88563487352666, 290.7989566379839, 1.2382583671084981, 19.0),
];

#[test]
fn a_ridge_ending_at_a_left_out_hip_is_cut_back_to_a_hip_passing_by() {
    let frame = framed(&SEED_22164, &[&SEED_22164_COURTYARD]);
    // The ridge along x = 250.846 ends south at (250.846, 279.434), where a
    // hip of 2.9 in to the end of the ridge along x = 251.970 is left out.
    // The hip from (265.681, 393.309) up to that other ridge's end at
    // (251.970, 276.764) passes the first ridge's end: at y = 279.434 its
    // centre line is at x = 251.970 + 2.670 x 13.711 / 116.545 = 252.284
    // and its west face 0.75 / cos 6.71 deg = 0.755 in west of that, at
    // 251.529, while the ridge's east side is at 250.846 + 0.75 = 251.596:
    // 0.067 in into the hip. The ridge's end is cut back to the hip's side
    // and bears on it. Derivation.
    let ridge = frame
        .pieces
        .iter()
        .position(|p| p.kind == MemberKind::Ridge && p.plan_line.iter().all(|q| (q.x - 250.846).abs() < 0.01))
        .expect("the ridge along x = 250.846");
    let hip = frame
        .pieces
        .iter()
        .position(|p| {
            p.kind == MemberKind::Hip
                && p.plan_line[0].distance(dvec2(265.681, 393.309)) < 0.01
                && p.plan_line[1].distance(dvec2(251.970, 276.764)) < 0.01
        })
        .expect("the hip passing the ridge's end");
    let joint =
        frame.joints.iter().find(|j| j.pieces == [ridge, hip]).expect("the ridge's end bears on the hip");
    assert!(joint.max_gap < FIT_IN && joint.max_overlap < FIT_IN, "{joint:?}");
    let (_, overlap, _) = parry_fit::fit(&frame, ridge, hip);
    assert!(overlap < FIT_IN, "parry overlap {overlap}");
    for j in frame.joints.iter().filter(|j| j.pieces.contains(&ridge) || j.pieces.contains(&hip)) {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
    }
}

/// Seed 1352: a block with a square courtyard, 6/12 outside and 17/12
/// round the courtyard.
#[rustfmt::skip]
const SEED_1352: [WallRow; 7] = [
    (0.0, 250.62218933879558, 0.5, 4.0),
    (372.5436449633291, 250.62218933879558, 0.5, 22.0),
    (372.5497768481325, 250.61605745399214, 0.5, 21.0),
    (372.5497768481325, 0.0, 0.5, 19.0),
    (186.27488842406626, 0.0, 0.5, 18.0),
    (186.27488842406626, 125.31109466939779, 0.5, 10.0),
    (0.0, 125.31109466939779, 0.5, 16.0),
];

#[rustfmt::skip]
const SEED_1352_COURTYARD: [WallRow; 4] = [
    (180.3747651266867, 129.71422458160728, 1.4166666666666667, 15.0),
    (234.09985359642084, 129.71422458160728, 1.4166666666666667, 7.0),
    (234.09985359642084, 168.5900055249423, 1.4166666666666667, 9.0),
    (180.3747651266867, 168.5900055249423, 1.4166666666666667, 20.0),
];

#[test]
fn a_ridge_end_and_a_valley_top_beside_a_king_are_cut_back_to_its_side() {
    let frame = framed(&SEED_1352, &[&SEED_1352_COURTYARD]);
    // The ridge along y = 187.967 has a hip end at x = 158.261; its king
    // from the north wall runs south along x = 158.261, its board from
    // x = 157.511 to 159.011. A hip of 2.1 in from there to the west end
    // of the ridge along y = 189.990 (x = 158.975, 1 in lower) is left
    // out; that ridge's end and the top of the valley rising to it from
    // the courtyard's corner (180.375, 168.590) ran 0.036 in and 0.35 in
    // into the king. Both are cut back to the king's east side at
    // x = 158.261 + 0.75 = 159.011 and bear on it. Derivation.
    let king_face_x = 158.261_042_538 + FramingSettings::default().rafter.thickness_in / 2.0;
    let king = frame
        .pieces
        .iter()
        .position(|p| {
            p.kind == MemberKind::KingCommon
                && p.plan_line.iter().all(|q| (q.x - 158.261).abs() < 0.01)
                && p.plan_line[0].y > 200.0
        })
        .expect("the king from the north wall");
    let ridge = frame
        .pieces
        .iter()
        .position(|p| p.kind == MemberKind::Ridge && p.plan_line.iter().all(|q| (q.y - 189.990).abs() < 0.01))
        .expect("the ridge along y = 189.990");
    let valley = piece_ending_at(&frame, MemberKind::Valley, 1, dvec2(158.975, 189.990))
        .expect("the valley up to the ridge's end");
    for piece in [ridge, valley] {
        let westmost = frame.pieces[piece].solid.vertices().map(|v| v.x).fold(f64::INFINITY, f64::min);
        assert!(westmost > king_face_x - 1e-6, "{} reaches x = {westmost}", frame.pieces[piece].label);
        let joint = frame
            .joints
            .iter()
            .find(|j| j.pieces == [piece, king])
            .unwrap_or_else(|| panic!("{} bears on the king", frame.pieces[piece].label));
        assert!(joint.max_gap < FIT_IN && joint.max_overlap < FIT_IN, "{joint:?}");
        let (_, overlap, _) = parry_fit::fit(&frame, piece, king);
        assert!(overlap < FIT_IN, "{}: parry overlap {overlap}", frame.pieces[piece].label);
    }
    for j in frame.joints.iter().filter(|j| j.pieces.contains(&king)) {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
    }
}

/// Seed 2504: a long block with a wing north-west, walls a hair out of
/// line at its corners, mixed pitches.
#[rustfmt::skip]
const SEED_2504: [WallRow; 11] = [
    (0.0, 267.9213387584438, 1.25, 23.0),
    (0.01700624537508328, 267.9383450038189, 1.5, 8.0),
    (177.05454651281943, 267.9383450038189, 1.0, 6.0),
    (177.0757560840354, 267.9171354326029, 0.38651577670349857, 24.0),
    (177.0757560840354, 199.0971139646979, 1.0, 9.0),
    (177.0935374387606, 199.0793326099727, 0.75, 2.0),
    (1062.4360970669748, 199.0793326099727, 1.0833333333333333, 22.0),
    (1062.4545365042125, 199.06089317273498, 0.8333333333333334, 22.0),
    (1062.4545365042125, 0.0, 0.5536247208543009, 6.0),
    (0.018952240191145428, 0.0, 0.38706720420741786, 21.0),
    (0.0, 0.018952240191145428, 1.4166666666666667, 3.0),
];

/// Seed 3072: a long block at 3/12 with two wings north, its west wall
/// and the north wall east of the east wing each bent by a hair.
#[rustfmt::skip]
const SEED_3072: [WallRow; 12] = [
    (0.0, 0.0, 0.2515071967878663, 13.0),
    (1140.4690133866545, 0.0, 0.2515071967878663, 17.0),
    (1140.4690133866545, 221.42106761396803, 0.2515071967878663, 16.0),
    (1082.393506955501, 221.28285387861274, 0.2515071967878663, 21.0),
    (1018.5646360788403, 221.42106761396803, 0.2515071967878663, 11.0),
    (1018.5646360788403, 885.6842704558721, 0.2515071967878663, 15.0),
    (797.9361354256619, 885.6842704558721, 0.2515071967878663, 6.0),
    (797.9361354256619, 221.42106761396803, 0.2515071967878663, 12.0),
    (130.5220759485384, 221.42106761396803, 0.2515071967878663, 16.0),
    (130.5220759485384, 1107.1053380698402, 0.2515071967878663, 22.0),
    (0.0, 1107.1053380698402, 0.2515071967878663, 17.0),
    (0.35202839694789034, 700.1476502554078, 0.2515071967878663, 15.0),
];

/// Seed 3742: a star-drawn block whose north-south ridge meets a ridge
/// at 45 degrees across a hip too short to cut (0.87 in).
#[rustfmt::skip]
const SEED_3742: [WallRow; 9] = [
    (68.18717683877155, 421.39170218346527, 1.1666666666666667, 14.0),
    (272.7487073550862, 421.39170218346527, 0.75, 23.0),
    (272.7487073550862, 251.96108983542427, 0.3333333333333333, 22.0),
    (272.74375225170706, 251.95613473204514, 0.6666666666666666, 1.0),
    (136.38248334952814, 251.95613473204514, 1.3333333333333333, 1.0),
    (136.3743536775431, 251.9480050600601, 1.1666666666666667, 15.0),
    (136.3743536775431, 0.0061295808361940185, 1.0833333333333333, 12.0),
    (136.3682240967069, 0.0, 1.1039770180336086, 1.0),
    (68.18717683877155, 0.0, 1.3322295120032468, 0.0),
];

#[test]
fn a_joint_that_does_not_fit_is_flagged_on_the_member_cut_to_it() {
    let frame = framed(&SEED_3742, &[]);
    // A valley's top, cut to one ridge's side where it stands above that
    // ridge's top, faces the side of the ridge meeting it at 45 degrees
    // 0.34 in off across a hip too short to cut (a fault of the framing
    // not mended yet; should it be, this test wants another frame with a
    // misfit). The member cut to fit is flagged with both labels and the
    // gap and overlap the joint check measured; a joint that fits is not
    // flagged.
    let misfits: Vec<_> =
        frame.joints.iter().filter(|j| !(j.max_gap < FIT_IN && j.max_overlap < FIT_IN)).collect();
    assert!(!misfits.is_empty());
    for j in &frame.joints {
        let member = frame.members.iter().find(|m| m.label == j.members[0]).unwrap();
        let warning = FramingWarning::JointDoesNotFit {
            label: j.members[0].clone(),
            bears_on: j.members[1].clone(),
            gap_in: j.max_gap,
            overlap_in: j.max_overlap,
        };
        let fits = j.max_gap < FIT_IN && j.max_overlap < FIT_IN;
        assert_eq!(member.warnings.contains(&warning), !fits, "{j:?}");
        assert_eq!(frame.warnings.contains(&warning), !fits, "{j:?}");
    }
}

/// Seed 2266: a long block with two wings north and one south, every wall
/// 12/12.
#[rustfmt::skip]
const SEED_2266: [WallRow; 14] = [
    (0.0, 548.9040445583639, 1.0, 19.0),
    (222.97646977358517, 548.9040445583639, 1.0, 9.0),
    (222.97646977358517, 224.72220377887186, 1.0, 15.0),
    (445.95293954717033, 224.72220377887186, 1.0, 18.0),
    (445.95293954717033, 320.53390546980563, 1.0, 7.0),
    (668.9294093207554, 320.53390546980563, 1.0, 14.0),
    (668.9294093207554, 224.72220377887186, 1.0, 11.0),
    (891.9058790943407, 224.72220377887186, 1.0, 14.0),
    (891.9058790943407, 654.0926108839287, 1.0, 21.0),
    (1114.8823488679259, 654.0926108839287, 1.0, 13.0),
    (1114.8823488679259, 224.72220377887186, 1.0, 3.0),
    (1337.858818641511, 224.72220377887186, 1.0, 17.0),
    (1337.858818641511, 0.0, 1.0, 5.0),
    (0.0, 0.0, 1.0, 21.0),
];

#[test]
fn valley_tops_just_short_of_a_ridge_passing_by_are_cut_to_its_side() {
    let frame = framed(&SEED_2266, &[]);
    // The main ridge runs along y = 112.361, half the block's 224.722 in
    // depth north to south. Each wing north of it is 222.976 in wide, so
    // its valleys run at 45 degrees (equal pitches) from its inside
    // corners on y = 224.722 for half that, 111.488 in, to meet the
    // wing's ridge at y = 224.722 - 111.488 = 113.234 (x = 557.441 and
    // 1003.394): 0.873 in north of the main ridge's centre line, whose
    // north face is at 112.361 + 0.75 = 113.111. Cut to the wing ridge's end only, each
    // valley's top ran 0.19 in into the main ridge. Each is now cut back
    // to that north face as well and bears on it. Derivation.
    let north_face_y = 112.361_101_889 + FramingSettings::default().ridge.thickness_in / 2.0;
    let nodes = [dvec2(557.441_2, 113.234), dvec2(1_003.394_1, 113.234)];
    let valleys: Vec<usize> = frame
        .pieces
        .iter()
        .enumerate()
        .filter(|(_, p)| {
            p.kind == MemberKind::Valley && nodes.iter().any(|n| p.plan_line[1].distance(*n) < 0.01)
        })
        .map(|(i, _)| i)
        .collect();
    assert_eq!(valleys.len(), 4, "two valleys up to each wing's ridge");
    for &v in &valleys {
        let southmost = frame.pieces[v].solid.vertices().map(|p| p.y).fold(f64::INFINITY, f64::min);
        assert!(southmost > north_face_y - 1e-4, "{} reaches y = {southmost}", frame.pieces[v].label);
        let on_main: Vec<_> = frame
            .joints
            .iter()
            .filter(|j| {
                j.pieces[0] == v
                    && frame.pieces[j.pieces[1]].kind == MemberKind::Ridge
                    && frame.pieces[j.pieces[1]].plan_line.iter().all(|q| (q.y - 112.361).abs() < 0.01)
            })
            .collect();
        assert_eq!(on_main.len(), 1, "{} bears on the main ridge", frame.pieces[v].label);
        for j in frame.joints.iter().filter(|j| j.pieces[0] == v) {
            assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
            let (gap, overlap, _) = parry_fit::fit(&frame, j.pieces[0], j.pieces[1]);
            assert!(gap < FIT_IN && overlap < FIT_IN, "{:?}: parry {gap} / {overlap}", j.members);
        }
    }
}

/// Seed 2020: a block whose west side is five walls a hair out of line,
/// mixed pitches.
#[rustfmt::skip]
const SEED_2020: [WallRow; 17] = [
    (0.0, 149.73461011557035, 1.3333333333333333, 21.0),
    (0.1279714298428425, 185.16458689349344, 0.75, 10.0),
    (0.0, 239.69528860242127, 0.8333333333333334, 3.0),
    (0.0, 367.1009429802518, 0.8143930557155104, 8.0),
    (-0.13465174234458535, 425.731816323512, 0.9166666666666666, 3.0),
    (0.0, 475.5917931981111, 0.16666666666666666, 21.0),
    (107.20509790746424, 475.5917931981111, 0.16666666666666666, 17.0),
    (292.58736094748565, 475.5917931981111, 0.16666666666666666, 22.0),
    (435.12114845488713, 475.5917931981111, 1.0, 6.0),
    (435.12114845488713, 248.57423521305773, 1.3077975791771466, 12.0),
    (435.2242942496129, 221.185477944791, 0.5455221384004488, 10.0),
    (435.12114845488713, 182.5441594741089, 1.0833333333333333, 18.0),
    (435.12114845488713, 101.53106877499064, 1.0833333333333333, 6.0),
    (435.12114845488713, 0.0, 0.9166666666666666, 7.0),
    (267.09817423130676, 0.0, 0.75, 1.0),
    (122.2983651740265, -0.3985062827838556, 1.0833333333333333, 4.0),
    (0.0, 0.0, 0.44640264309430044, 14.0),
];

#[test]
fn a_hip_carrying_a_valleys_line_on_past_its_top_butts_against_it() {
    let frame = framed(&SEED_2020, &[]);
    // Walls 3 and 4 on the west side meet 0.13 in out of line: the valley
    // over their corner (0, 367.101) rises only 2.85 in, to
    // (3.423, 401.769), and a hip of almost no rise (0.03 in over 56.5 in)
    // carries its line on north to (3.326, 458.315), 5.7 degrees off the
    // valley's line. Cut to the valley's side, a plane running nearly
    // along the hip, the hip's foot was a sliver 0.83 in off the valley.
    // It now butts against the valley's top, plumb through the node square
    // to the valley, and bears on it there. Derivation.
    let node = dvec2(3.423_1, 401.769_3);
    let valley_dir = (node - dvec2(0.0, 367.100_9)).normalize();
    let hip =
        piece_ending_at(&frame, MemberKind::Hip, 0, node).expect("the hip starting at the valley's top");
    let valley = piece_ending_at(&frame, MemberKind::Valley, 1, node).expect("the valley up to the node");
    let behind = frame.pieces[hip]
        .solid
        .vertices()
        .map(|v| (v.truncate() - node).dot(valley_dir))
        .fold(f64::INFINITY, f64::min);
    assert!(behind > -1e-3, "the hip reaches {behind} in back past the valley's top");
    let joint = frame.joints.iter().find(|j| j.pieces == [hip, valley]).expect("the hip bears on the valley");
    assert!(joint.max_gap < FIT_IN && joint.max_overlap < FIT_IN, "{joint:?}");
    let (gap, overlap, mating) = parry_fit::fit(&frame, hip, valley);
    assert!(mating >= 1 && gap < FIT_IN && overlap < FIT_IN, "parry {gap} / {overlap}");
}

/// Every joint of `frame` fits by the frame's own reading, and each hip
/// jack's cheek on its hip fits as parry measures the two solids too
/// (1/64 in, common practice, no source).
fn assert_hip_jacks_fit(frame: &Frame) {
    for j in &frame.joints {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        let kinds = (frame.pieces[j.pieces[0]].kind, frame.pieces[j.pieces[1]].kind);
        if kinds == (MemberKind::HipJack, MemberKind::Hip)
            && parry_fit::measurable(frame, j.pieces[0], j.pieces[1])
        {
            let (gap, overlap, mating) = parry_fit::fit(frame, j.pieces[0], j.pieces[1]);
            assert!(
                mating >= 1 && gap < FIT_IN && overlap < FIT_IN,
                "{:?}: parry {gap} / {overlap}",
                j.members
            );
        }
    }
}

/// Seed 12788: walls 2 and 3 run in line along y = 0 at one pitch
/// (13/12), wall 2 with no overhang and wall 3 with 23 in; wall 1 (3/12)
/// meets wall 2 0.11 in out of line. The hip between planes 1 and 2 runs
/// from their corner (135.26, 0) along the wall line, only 0.19 in inside
/// it at (457.22, 0.19) 322 in on, so plane 2's strip beside it is under
/// 0.2 in wide (derived from the walls). The hip has no tail (wall 2 has
/// no overhang) and is cut plumb along the wall line; wall 3's jacks,
/// laid every 24 in, ran from the fascia to the hip's side 0.64 in
/// outside the wall line, where nothing of the hip is left: tails with
/// nothing to bear on (gaps of 0.57 to 0.64 in). They are left out.
#[test]
fn jacks_that_are_only_tails_past_a_hip_cut_at_its_wall_line_are_left_out() {
    let frame = framed(&SEED_12788, &[]);
    assert_hip_jacks_fit(&frame);
    let on_wall_3 = frame
        .pieces
        .iter()
        .filter(|p| p.kind == MemberKind::HipJack)
        .filter(|p| p.plan_line[0].y.abs() < 1.0 && (302.6..458.1).contains(&p.plan_line[0].x))
        .count();
    assert_eq!(on_wall_3, 0, "hip jacks laid out on wall 3");
    // The framer is told how many: the layout's 24 in marks from corner 0
    // fall on wall 3 at x = 312, 336, ..., 432 (derived from the walls and
    // the default spacing; the mark at 456, 2 in from the corner at
    // 458.05 where the hips crowd, had no jack before either).
    let left_out: Vec<(&str, usize)> = frame
        .members
        .iter()
        .flat_map(|m| &m.warnings)
        .filter_map(|w| match w {
            FramingWarning::TailsLeftOut { label, count } => Some((label.as_str(), *count)),
            _ => None,
        })
        .collect();
    assert_eq!(left_out.len(), 1, "{left_out:?}");
    assert_eq!(left_out[0].1, 6, "{left_out:?}");
}

/// Seed 871: the same on a star plan. Walls 3 and 4 run in line at one
/// pitch, wall 3 with no overhang, wall 4 with 21 in, and wall 2 meets
/// wall 3 0.12 degrees out of line: the hip from their corner runs along
/// walls 3 and 4 within 0.3 in of the wall line (it rises 0.26 in over
/// its 58 in), and wall 4's jacks were only tails outside the wall line
/// (gaps of 0.55 and 0.64 in).
#[test]
fn jacks_that_are_only_tails_past_a_hip_cut_at_its_wall_line_are_left_out_on_a_star() {
    let frame = framed(&SEED_871, &[]);
    assert_hip_jacks_fit(&frame);
}

#[rustfmt::skip]
const SEED_12788: [WallRow; 13] = [
    (0.0, 0.0, 1.3212929738159913, 3.0), // 0
    (79.17126735410582, 0.11179082513970742, 0.25, 16.0), // 1
    (135.26106856999922, 0.0, 1.0833333333333333, 0.0), // 2
    (302.6103701166802, 0.0, 1.0833333333333333, 23.0), // 3
    (458.0498921070851, 0.0, 0.25, 9.0), // 4
    (458.30956958170685, 126.6292600247236, 1.5, 11.0), // 5
    (458.0498921070851, 194.2744881086704, 1.1666666666666667, 7.0), // 6
    (370.5341367628785, 194.2744881086704, 1.1666666666666667, 20.0), // 7
    (308.3089691440731, 194.2744881086704, 1.1666666666666667, 21.0), // 8
    (229.02494605354255, 194.2744881086704, 1.0694891231650934, 21.0), // 9
    (229.02494605354255, 319.15745765229804, 1.25, 21.0), // 10
    (0.0, 319.15745765229804, 1.0833333333333333, 6.0), // 11
    (0.0, 194.2744881086704, 1.0833333333333333, 3.0), // 12
];

#[rustfmt::skip]
const SEED_871: [WallRow; 24] = [
    (-112.08580668484363, -46.764414117638, 0.5938343129834585, 9.0), // 0
    (-99.38199878962622, -124.19790622982907, 0.6666666666666666, 17.0), // 1
    (-81.89892041524129, -134.53693042312457, 0.75, 2.0), // 2
    (-63.67114408373706, -145.41981054742803, 1.139448749216421, 0.0), // 3
    (-47.536897614444015, -155.007915834402, 1.139448749216421, 21.0), // 4
    (-13.619650581229548, -175.16393218246614, 1.1666666666666667, 23.0), // 5
    (-0.5805260085275084, -162.66219852455603, 1.0833333333333333, 17.0), // 6
    (8.026438860325685, -154.40334515512714, 1.0833333333333333, 4.0), // 7
    (16.930885004423235, -145.8724980168679, 0.75, 13.0), // 8
    (76.0447517105514, -124.51594027826322, 1.0, 1.0), // 9
    (109.24152895678307, -112.75477487774997, 1.0, 23.0), // 10
    (158.9809173905734, -47.87124188035597, 0.5, 16.0), // 11
    (131.87038631033994, -8.583662748076675, 1.4166666666666667, 14.0), // 12
    (111.90304030541395, 20.324203124780144, 0.16666666666666666, 19.0), // 13
    (114.82159033616342, 83.29872951848154, 0.75, 18.0), // 14
    (101.7700992087274, 85.977520678161, 0.75, 7.0), // 15
    (82.73626908673079, 89.8841743599355, 1.0833333333333333, 17.0), // 16
    (11.662909442255218, 133.51333743956982, 1.4184039693250916, 8.0), // 17
    (-35.93794061115721, 180.8121771842568, 0.16666666666666666, 12.0), // 18
    (-130.25957981959297, 120.1513805862967, 1.0833333333333333, 1.0), // 19
    (-138.3624531936707, 97.08757744835775, 1.0833333333333333, 21.0), // 20
    (-148.52336745770285, 68.16582148993064, 0.5833333333333334, 15.0), // 21
    (-139.62765861214328, 32.44056631781586, 0.5833333333333334, 10.0), // 22
    (-130.44909820573037, -4.420623535025395, 0.954970230857445, 16.0), // 23
];

/// A king common, its foot (plan line's lower end) at `king_foot`, running on past the
/// hip end of another ridge at `node` less than a rafter's thickness off
/// it, square to that ridge (`into`: the unit plan direction from the
/// king's line into the ridge). The end's own king in that plane is left
/// out, so no rafter's board overlaps the passing king's; the ridge ending
/// at `node` is cut back to the king's side and bears on it, as the hip
/// ending there does; every joint cut to the king or by it fits, by the
/// frame's own check and by parry.
fn assert_king_stands_in(frame: &Frame, king_foot: glam::DVec2, node: glam::DVec2, into: glam::DVec2) {
    let half = FramingSettings::default().rafter.thickness_in / 2.0;
    let king = piece_ending_at(frame, MemberKind::KingCommon, 0, king_foot)
        .unwrap_or_else(|| panic!("the passing king"));
    // Rafters in one plane share their top and bottom planes, so two
    // boards side by side overlap where their centre lines are less than
    // a thickness apart in plan over a common stretch: no corner of either
    // is inside the other to show it.
    let [foot, top] = frame.pieces[king].plan_line;
    let up = (top - foot).normalize();
    for (i, p) in frame
        .pieces
        .iter()
        .enumerate()
        .filter(|(i, p)| *i != king && matches!(p.kind, MemberKind::Common | MemberKind::KingCommon))
    {
        let [a, b] = p.plan_line;
        let parallel = (b - a).normalize().perp_dot(up).abs() < 1e-9;
        let apart = (a - foot).perp_dot(up).abs();
        let (lo, hi) =
            ((a - foot).dot(up).min((b - foot).dot(up)), (a - foot).dot(up).max((b - foot).dot(up)));
        let side_by_side = lo < foot.distance(top) && hi > 0.0;
        assert!(
            !(parallel && side_by_side && apart < 2.0 * half - FIT_IN),
            "{} (piece {i}) lies {apart} in beside the king",
            p.label
        );
    }
    let ridge = frame
        .pieces
        .iter()
        .position(|p| p.kind == MemberKind::Ridge && p.plan_line.iter().any(|q| q.distance(node) < 1.0))
        .unwrap_or_else(|| panic!("the ridge ending at the node"));
    let nearest = frame.pieces[ridge]
        .solid
        .vertices()
        .map(|v| (v.truncate() - king_foot).dot(into))
        .fold(f64::INFINITY, f64::min);
    assert!(nearest > half - 1e-6, "the ridge reaches {nearest} in from the king's line");
    let hip = piece_ending_at(frame, MemberKind::Hip, 1, node)
        .unwrap_or_else(|| panic!("the hip ending at the node"));
    let joint = frame
        .joints
        .iter()
        .find(|j| j.pieces == [ridge, king])
        .unwrap_or_else(|| panic!("{} bears on the king", frame.pieces[ridge].label));
    assert!(joint.max_gap < FIT_IN && joint.max_overlap < FIT_IN, "{joint:?}");
    // The hip's top bears on the king's side, or, where it meets the
    // ridge's side short of the king (a hip coming in at a low plan angle
    // to the king), on the ridge; either way it fits and runs into neither.
    let top_joints: Vec<_> =
        frame.joints.iter().filter(|j| j.pieces == [hip, king] || j.pieces == [hip, ridge]).collect();
    assert!(!top_joints.is_empty(), "{} bears on neither the king nor the ridge", frame.pieces[hip].label);
    for j in top_joints {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
    }
    let pair = |a: usize, b: usize| {
        (a == hip && (b == king || b == ridge)) || (b == hip && (a == king || a == ridge))
    };
    let (depth, a, b, _) = parry_fit::interference_where_measurable(frame, |a, b| !pair(a, b));
    assert!(depth < FIT_IN, "{a} and {b} share {depth} in");
    for j in frame.joints.iter().filter(|j| j.pieces.contains(&king)) {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        let (gap, overlap, _) = parry_fit::fit(frame, j.pieces[0], j.pieces[1]);
        assert!(gap < FIT_IN && overlap < FIT_IN, "{:?}: parry {gap} / {overlap}", j.members);
    }
}

/// Seed 6038: a block in 3/12, its walls split in runs in line, with a courtyard at 13/12.
#[rustfmt::skip]
const SEED_6038: [WallRow; 12] = [
    (0.0, 564.6909940283906, 0.25, 8.0),
    (143.8872275167792, 564.6909940283906, 0.25, 5.0),
    (303.7526007320381, 564.6909940283906, 0.25, 15.0),
    (303.7526007320381, 863.6756864518961, 0.25, 8.0),
    (303.74737668444425, 863.68091049949, 0.25, 22.0),
    (277.7738034031974, 863.6809104994899, 0.25, 9.0),
    (251.45399148392443, 863.68091049949, 0.25, 15.0),
    (213.37041987905366, 863.68091049949, 0.25, 12.0),
    (213.36194671693647, 863.68091049949, 0.25, 21.0),
    (0.0, 863.68091049949, 0.25, 23.0),
    (0.0, 694.9946006528075, 0.25, 7.0),
    (0.0, 694.9859779427729, 0.25, 4.0),
];

#[rustfmt::skip]
const SEED_6038_COURTYARD: [WallRow; 4] = [
    (186.51272074911785, 814.9280578250142, 1.0833333333333333, 18.0),
    (236.0426291992571, 814.9280578250142, 1.0833333333333333, 5.0),
    (236.0426291992571, 759.0185991737845, 1.0833333333333333, 24.0),
    (186.51272074911785, 759.0185991737845, 1.0833333333333333, 9.0),
];

#[test]
fn a_king_passing_a_short_ridges_hip_end_stands_in_for_its_king() {
    let frame = framed(&SEED_6038, &[&SEED_6038_COURTYARD]);
    // The main ridge along y = 714.186 has its east hip end at
    // x = 154.258; its king from the north wall runs south along that line
    // (board from x = 153.508 to 155.008), past the west end of the ridge
    // along y = 727.620 at x = 155.114, 0.856 in off its line, where a hip
    // and a valley end. That end's own king from the north wall, along
    // x = 155.114, overlapped it by 1.5 - 0.856 = 0.644 in, and the ridge's
    // end, run half a rafter past its node to x = 154.364, ran 0.644 in
    // into it. The end's king is left out: the ridge's end is cut back to
    // the passing king's east side at x = 155.008 and bears on it, and so
    // does the hip's top. Derivation (nodes from the solved roof's lines).
    assert_king_stands_in(
        &frame,
        dvec2(154.25764249648842, 863.68091049949),
        dvec2(155.1140273514062, 727.6199057760728),
        dvec2(1.0, 0.0),
    );
}

/// Seed 13528: an orthogonal outline of 23 walls, mixed pitches.
#[rustfmt::skip]
const SEED_13528: [WallRow; 23] = [
    (0.0, 0.0, 1.0833333333333333, 17.0),
    (239.91133777222447, 0.0, 1.13614986547982, 2.0),
    (239.91133777222447, 534.4277585488372, 0.3333333333333333, 20.0),
    (479.82267554444894, 534.4277585488372, 1.4166666666666667, 4.0),
    (479.82267554444894, 733.0180003133647, 0.5583443432327554, 5.0),
    (580.9584323860753, 733.0180003133647, 0.5583443432327554, 18.0),
    (657.3260796089637, 733.0180003133647, 0.5583443432327554, 6.0),
    (719.7340133166734, 733.0180003133647, 0.16666666666666666, 20.0),
    (719.7340133166734, 832.0723570451033, 0.16666666666666666, 12.0),
    (719.7340133166734, 912.1092498131047, 1.5, 15.0),
    (239.91133777222447, 912.1092498131047, 1.1666666666666667, 13.0),
    (239.91133777222444, 989.1092850982661, 1.1666666666666667, 4.0),
    (239.91133777222447, 1066.5646831359034, 1.1666666666666667, 24.0),
    (239.91133777222447, 1165.038794291531, 1.1666666666666667, 1.0),
    (239.91133777222447, 1197.9313239574592, 1.1666666666666667, 4.0),
    (239.91133777222447, 1239.1554661199675, 1.1666666666666667, 11.0),
    (239.91133777222447, 1267.6872408261777, 0.5833333333333334, 2.0),
    (135.9975814207492, 1267.6872408261777, 0.5833333333333334, 6.0),
    (73.53785210575218, 1267.6872408261777, 0.5833333333333334, 17.0),
    (0.0, 1267.6872408261777, 1.0833333333333333, 2.0),
    (0.0, 1165.038794291531, 1.0833333333333333, 18.0),
    (0.0, 733.0180003133647, 1.0833333333333333, 13.0),
    (0.0, 534.4277585488372, 1.0833333333333333, 6.0),
];

#[test]
fn a_king_passing_a_ridges_hip_end_1_4_in_off_stands_in_for_its_king() {
    let frame = framed(&SEED_13528, &[]);
    // The king along y = 815.583 from the east wall (x = 719.734) runs
    // west to the north hip end of the ridge along x = 157.424, past the
    // north end of the ridge along x = 447.834 at y = 814.180, 1.403 in
    // off its line, where a hip and a valley end. That end's own king from
    // the east wall, along y = 814.180, overlapped it by 1.5 - 1.403 =
    // 0.097 in, and the ridge's end, run half a rafter past its node to
    // y = 814.930, ran 0.097 in into it. The end's king is left out: the
    // ridge's end is cut back to the passing king's south side at
    // y = 815.583 - 0.75 = 814.833 and bears on it. The hip from the
    // south-east, at 16.6 degrees to the king in plan, meets the ridge's
    // east side (x = 448.584) with its north side at y = 814.738, short
    // of the king: it bears on the ridge (cut to the king only, it ran
    // into the ridge's side with no corner of either inside the other).
    // Derivation (nodes from the solved roof's lines).
    assert_king_stands_in(
        &frame,
        dvec2(719.7340133166734, 815.582949758633),
        dvec2(447.83449717481903, 814.1804345224482),
        dvec2(0.0, -1.0),
    );
}

/// Seed 16492: an orthogonal outline of 19 walls with a courtyard, mixed pitches.
#[rustfmt::skip]
const SEED_16492: [WallRow; 19] = [
    (0.0, 748.1741530962496, 1.0833333333333333, 8.0),
    (222.22912716738685, 748.1741530962496, 0.5833333333333334, 9.0),
    (222.22912716738685, 788.8955866497496, 0.4166666666666667, 13.0),
    (829.6144924915661, 788.8955866497496, 0.5833333333333334, 21.0),
    (829.6144924915661, 748.1741530962496, 1.2061517416218603, 11.0),
    (917.6807853473717, 748.1741530962496, 0.4166666666666667, 12.0),
    (917.6807853473717, 546.5993947120377, 0.5, 22.0),
    (1092.0557269017174, 546.5993947120377, 0.6666666666666666, 15.0),
    (1092.0557269017174, 248.58186021529778, 1.0347286503562312, 22.0),
    (917.6807853473717, 248.58186021529778, 1.0347286503562312, 4.0),
    (829.6144924915661, 248.58186021529778, 0.4166666666666667, 1.0),
    (829.6144924915661, 0.0, 0.4777641568196403, 18.0),
    (752.9372573044423, 0.0, 1.25, 2.0),
    (752.9372573044423, 248.58186021529778, 1.14418521102343, 21.0),
    (466.49801099547886, 248.58186021529778, 1.14418521102343, 16.0),
    (329.7440712097133, 248.5818602152978, 1.14418521102343, 24.0),
    (222.22912716738685, 248.58186021529778, 1.4190902970361163, 5.0),
    (222.22912716738685, 0.0, 0.5, 16.0),
    (0.0, 0.0, 1.4166666666666667, 8.0),
];

#[rustfmt::skip]
const SEED_16492_COURTYARD: [WallRow; 4] = [
    (572.7377187188027, 621.7029656511045, 0.9166666666666666, 9.0),
    (723.5933500766558, 621.7029656511045, 0.9166666666666666, 10.0),
    (723.5933500766558, 463.91190976452464, 0.25, 23.0),
    (572.7377187188027, 463.91190976452464, 0.6666666666666666, 0.0),
];

#[test]
fn a_king_passing_a_ridges_hip_end_0_9_in_off_stands_in_for_its_king() {
    let frame = framed(&SEED_16492, &[&SEED_16492_COURTYARD]);
    // The king along x = 784.246 from the north wall (y = 788.896) runs
    // south to the north hip end of the ridge along x = 784.246 at
    // y = 655.460, past the west end of the ridge along y = 726.683 at
    // x = 785.177, 0.931 in off its line, where a hip and a valley end.
    // That end's own king from the north wall, along x = 785.177,
    // overlapped it by 1.5 - 0.931 = 0.569 in, and the ridge's end, run
    // half a rafter past its node to x = 784.427, ran 0.569 in into it.
    // The end's king is left out: the ridge's end is cut back to the
    // passing king's east side at x = 784.996 and bears on it, and so does
    // the hip's top. Derivation (nodes from the solved roof's lines).
    assert_king_stands_in(
        &frame,
        dvec2(784.2456735987545, 788.8955866497496),
        dvec2(785.176641651456, 726.6825954735954),
        dvec2(1.0, 0.0),
    );
}

/// Seed 16522: an orthogonal outline of 33 walls, mixed pitches.
#[rustfmt::skip]
const SEED_16522: [WallRow; 33] = [
    (297.9766610303755, 865.2752868500185, 0.4884651354221859, 5.0),
    (346.309430760869, 865.2752868500185, 0.717285163205188, 12.0),
    (346.309430760869, 631.6905531877117, 0.717285163205188, 0.0),
    (346.309430760869, 609.8104438366647, 0.717285163205188, 21.0),
    (346.309430760869, 586.2399548303222, 0.717285163205188, 6.0),
    (346.309430760869, 566.0503398314873, 0.717285163205188, 19.0),
    (346.309430760869, 340.98899972143374, 0.4166666666666667, 7.0),
    (387.13587287930096, 340.98899972143374, 0.4166666666666667, 5.0),
    (432.2757204444561, 340.98899972143374, 1.5, 7.0),
    (432.27572044445617, 218.51233267289678, 1.5, 14.0),
    (432.2757204444561, 63.52088023783199, 0.5833333333333334, 9.0),
    (346.309430760869, 63.52088023783199, 0.25, 13.0),
    (346.309430760869, 28.179763923169276, 0.25, 12.0),
    (346.309430760869, 0.0, 0.25, 7.0),
    (368.8326053753331, 0.0, 0.25, 17.0),
    (405.1020412614058, 0.0, 0.25, 13.0),
    (432.2757204444561, 0.0, 0.25, 23.0),
    (487.9958022659927, 0.0, 1.4166666666666667, 10.0),
    (487.9958022659927, 63.52088023783199, 0.5833333333333334, 4.0),
    (643.0402176344122, 63.52088023783199, 0.1921230919005549, 6.0),
    (643.0402176344122, 0.0, 0.16666666666666666, 18.0),
    (882.6377533341221, 0.0, 0.5833333333333334, 9.0),
    (882.6377533341222, 136.35769709546904, 0.5833333333333334, 20.0),
    (882.6377533341222, 237.1996692012367, 0.5833333333333334, 18.0),
    (882.6377533341221, 340.98899972143374, 0.5833333333333334, 2.0),
    (882.6377533341221, 631.6905531877117, 1.4166666666666667, 22.0),
    (487.9958022659927, 631.6905531877117, 1.1270920765667751, 12.0),
    (487.9958022659927, 865.2752868500185, 1.2943443377382435, 19.0),
    (559.9673800736138, 865.2752868500183, 1.2943443377382435, 7.0),
    (643.0402176344122, 865.2752868500185, 0.9166666666666666, 23.0),
    (643.0402176344122, 1006.1464420761129, 1.0, 6.0),
    (432.2757204444561, 1006.1464420761129, 1.0, 21.0),
    (297.9766610303755, 1006.1464420761129, 1.0833333333333333, 18.0),
];

#[test]
fn a_king_passing_a_ridges_hip_end_1_0_in_off_stands_in_for_its_king() {
    let frame = framed(&SEED_16522, &[]);
    // The king along x = 721.153 from the south wall (y = 0) runs north to
    // the east hip end of the ridge along y = 565.197, past the east end
    // of the ridge along y = 88.929 at x = 720.186, 0.967 in off its line,
    // where a hip and a valley end. That end's own king from the south
    // wall, along x = 720.186, overlapped it by 1.5 - 0.967 = 0.533 in,
    // and the ridge's end, run half a rafter past its node to x = 720.936,
    // ran 0.533 in into it. The end's king is left out: the ridge's end is
    // cut back to the passing king's west side at x = 720.403 and bears on
    // it, and so does the hip's top. (A hip on the upper ridge, which
    // missed it by 0.43 in, is stepped now: see
    // `a_hip_top_at_a_ridge_step_from_the_south_is_stepped_with_it`.)
    // Derivation (nodes from the solved roof's lines).
    assert_king_stands_in(
        &frame,
        dvec2(721.1529502635792, 0.0),
        dvec2(720.1862731946287, 88.92923233296479),
        dvec2(-1.0, 0.0),
    );
}

/// Seed 17264: an orthogonal outline of 11 walls, mixed pitches.
#[rustfmt::skip]
const SEED_17264: [WallRow; 11] = [
    (0.0, 153.3116931199438, 0.4811107792596367, 19.0),
    (0.011663832020880994, 153.32335695196468, 0.7058677892383941, 18.0),
    (188.41544824474022, 153.32335695196468, 1.5, 11.0),
    (188.41544824474022, 306.64671390392937, 0.8333333333333334, 14.0),
    (0.0, 306.64671390392937, 0.4166666666666667, 3.0),
    (0.0, 766.6167847598234, 0.25, 23.0),
    (467.9915748605372, 766.6167847598234, 1.0, 13.0),
    (467.9915748605372, 613.2934278078587, 1.3333333333333333, 16.0),
    (587.9300735894924, 613.2934278078587, 0.9166666666666666, 6.0),
    (587.9300735894924, 0.0, 1.0071712172071063, 11.0),
    (0.0, 0.0, 0.5833333333333334, 17.0),
];

#[test]
fn a_king_passing_a_ridges_hip_end_0_4_in_off_stands_in_for_its_king() {
    let frame = framed(&SEED_17264, &[]);
    // The king along x = 420.430 from the north wall (y = 766.617) runs
    // south to the east hip end of the ridge along y = 152.449, past the
    // west end of the ridge along y = 577.911 at x = 420.815, only 0.385 in
    // off its line, where a hip and a valley end. That end's own king from
    // the north wall, along x = 420.815, overlapped it by 1.5 - 0.385 =
    // 1.115 in, and the ridge's end, run half a rafter past its node to
    // x = 420.065, lay inside the king's board (x = 419.680 to 421.180),
    // 0.385 in from its west side. The end's king is left out: the ridge's end is cut back to the passing
    // king's east side at x = 421.180, 0.365 in in from its node, and bears
    // on it, and so do the hip's and the valley's tops. Derivation (nodes
    // from the solved roof's lines).
    assert_king_stands_in(
        &frame,
        dvec2(420.4297038553923, 766.6167847598234),
        dvec2(420.81515733685575, 577.9111146650977),
        dvec2(1.0, 0.0),
    );
}

/// No two pieces of `frame` for which `pair` holds share wood, as parry
/// measures their solids (1/64 in, common practice, no source), and parry
/// can hull every part.
fn assert_no_wood_shared(frame: &Frame, pair: impl Fn(MemberKind, MemberKind) -> bool) {
    let kind = |i: usize| frame.pieces[i].kind;
    let (depth, a, b, unhulled) =
        parry_fit::interference_where_measurable(frame, |i, j| !pair(kind(i), kind(j)));
    assert!(unhulled.is_empty(), "parts parry cannot hull: {unhulled:?}");
    assert!(depth < FIT_IN, "{a} and {b} share {depth} in");
}

/// Seed 10: two hips rising from the ridge ends at (229.758, 180.153)
/// and (56.541, 142.631) meet at the south ridge's north end
/// (76.555, 127.621), one each side of the courtyard's south wall's plane
/// (wall 8, x = 141.4 to 226.0, so the node lies west of the wall and the
/// plane has no king there). Each hip was cut to its other plane's king
/// (the kings along y = 127.621 from east and west) and to nothing on the
/// king-less side, so the two ran 0.12 in into each other in front of
/// the kings' ends (and 0.36 in at the north ridge's end). They now share
/// that space as hips at a peak do, each keeping the plan angle nearer
/// its own line; the whole frame shares no wood.
#[test]
fn hips_meeting_at_a_ridge_end_with_no_king_between_them_are_cut_to_each_other() {
    let frame = framed(&SEED_10, &[&SEED_10_COURTYARD]);
    for j in &frame.joints {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
    }
    assert_no_wood_shared(&frame, |_, _| true);
}

/// Seed 1: a star of ten walls where hips merge: the hips of walls 0/3
/// and 3/4 come up to (601.792, 399.165) and the hip of walls 0/4 rises
/// on from there, and so at two more nodes. Their ends were cut plumb at
/// the point, square to each hip, and overlapped each other by 0.4 to
/// 1.0 in round the node. Each end is now cut to the planes halving the
/// plan angles to its neighbours there (the hub cut of hips meeting at a
/// peak), so no two hips share wood (derived from the cut: the plan
/// angles each hip keeps do not overlap).
#[test]
fn hips_merging_into_one_rising_on_share_the_node() {
    let frame = framed(&SEED_1, &[]);
    assert_no_wood_shared(&frame, |a, b| a == MemberKind::Hip && b == MemberKind::Hip);
}

#[rustfmt::skip]
const SEED_10: [WallRow; 8] = [
    (0.0, 559.7636591154593, 0.5833333333333334, 22.0), // 0
    (244.0033583006307, 559.7636591154593, 0.342887773088532, 19.0), // 1
    (244.0033583006307, 111.95273182309187, 0.4166666666666667, 8.0), // 2
    (537.0369021154615, 111.95273182309187, 0.75, 9.0), // 3
    (537.0369021154615, 559.7636591154593, 1.3973536802002695, 11.0), // 4
    (653.2645698689691, 559.7636591154593, 0.16666666666666666, 2.0), // 5
    (653.2645698689691, 0.0, 1.25, 16.0), // 6
    (0.0, 0.0, 0.75, 14.0), // 7
];

#[rustfmt::skip]
const SEED_10_COURTYARD: [WallRow; 4] = [
    (141.35246319780708, 185.03712438087615, 1.0, 2.0),
    (225.9858773789959, 185.03712438087615, 1.2947937418737578, 0.0),
    (225.9858773789959, 270.8789627789717, 0.5, 21.0),
    (141.35246319780708, 270.8789627789717, 0.5, 8.0),
];

#[rustfmt::skip]
const SEED_1: [WallRow; 10] = [
    (-272.89590084567027, 640.3891739967203, 0.4166666666666667, 3.0), // 0
    (189.67757078083156, 754.0259024556372, 0.3333333333333333, 8.0), // 1
    (276.91457793172094, 543.5655104942502, 0.0, 23.0), // 2
    (770.1684227970999, 359.4200436491653, 1.0833333333333333, 9.0), // 3
    (726.2804472920795, -413.49228327992887, 0.25, 2.0), // 4
    (430.43575983297575, -619.2797437658228, 1.058097954138982, 15.0), // 5
    (12.911081124508172, -761.4580985831761, 1.1109056673111115, 4.0), // 6
    (-366.36900077365715, -644.9888356511227, 0.4166666666666667, 23.0), // 7
    (-666.5764873881443, -198.71035730997875, 0.0, 21.0), // 8
    (-904.1927761030192, 200.34459984662064, 0.9166666666666666, 13.0), // 9
];

/// Asserts that the valley whose top is at `top`, the end of one ridge,
/// is seated on that ridge and cut clear of the ridge at `far`, the other
/// end of a hip too short to cut (left out) from `top`: it has a joint on
/// each, and each fits within 1/64 in by the frame's own check and by
/// parry.
fn assert_valley_top_seated_beside_a_left_out_hip(frame: &Frame, top: glam::DVec2, far: glam::DVec2) {
    let valley = piece_ending_at(frame, MemberKind::Valley, 1, top)
        .unwrap_or_else(|| panic!("no valley's top at {top}"));
    let own = frame
        .pieces
        .iter()
        .position(|p| p.kind == MemberKind::Ridge && p.plan_line.iter().any(|e| e.distance(top) < 0.01))
        .unwrap_or_else(|| panic!("no ridge ending at the valley's top {top}"));
    let across = frame
        .pieces
        .iter()
        .enumerate()
        .position(|(i, p)| {
            let [a, b] = p.plan_line;
            let t = ((far - a).dot(b - a) / (b - a).length_squared()).clamp(0.0, 1.0);
            i != own && p.kind == MemberKind::Ridge && (a + (b - a) * t).distance(far) < 0.01
        })
        .unwrap_or_else(|| panic!("no ridge through the hip's other end {far}"));
    for ridge in [own, across] {
        let label = &frame.pieces[ridge].label;
        let j = frame
            .joints
            .iter()
            .find(|j| j.pieces == [valley, ridge])
            .unwrap_or_else(|| panic!("the valley's top has no joint on {label}"));
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        let (gap, overlap, mating) = parry_fit::fit(frame, valley, ridge);
        assert!(mating >= 1 && gap < FIT_IN && overlap < FIT_IN, "{:?}: parry {gap} / {overlap}", j.members);
    }
}

/// Seed 5340: an orthogonal outline of 8 walls with a courtyard, mixed pitches.
#[rustfmt::skip]
const SEED_5340: [WallRow; 8] = [
    (0.0, 0.0, 1.2066043687539318, 17.0),
    (358.7210412989785, 0.0, 0.35598312983951236, 21.0),
    (358.7210412989785, 938.0719149522666, 0.3333333333333333, 2.0),
    (0.0, 938.0719149522666, 0.5549440868310316, 22.0),
    (0.0, 457.3901183328445, 0.26510488880816396, 18.0),
    (175.58329729013295, 457.3901183328445, 0.5833333333333334, 23.0),
    (175.58329729013295, 286.8092529883387, 0.5, 21.0),
    (0.0, 286.8092529883387, 1.4166666666666667, 17.0),
];

// The draw's overhangs 6, 2, 22, 8 in cut to 6, 2, 10, 8 in: as
// drawn the courtyard is too small for them, and refused.
#[rustfmt::skip]
const SEED_5340_COURTYARD: [WallRow; 4] = [
    (272.15646094545343, 383.802810180881, 1.4359557074431943, 6.0),
    (293.34464933471827, 383.802810180881, 0.16666666666666666, 2.0),
    (293.34464933471827, 365.58471578437207, 0.3333333333333333, 10.0),
    (272.15646094545343, 365.58471578437207, 1.4166666666666667, 8.0),
];

#[test]
fn a_valley_top_is_seated_on_its_ridge_not_cut_to_the_side_of_one_beyond() {
    let frame = framed(&SEED_5340, &[&SEED_5340_COURTYARD]);
    // The valley rises from the courtyard's north-west corner to the north
    // end of the ridge along x = 243.989 at y = 411.592. A hip of 1.08 in
    // (left out) runs from there to the south end of the ridge along
    // x = 244.989 at y = 411.998, which runs on half a rafter to
    // y = 411.248. From that node the valley's line would leave the far
    // ridge through its east side, x = 245.739, 1.0 in east of the near
    // ridge's east side, x = 244.739: cut to it, the top was cut clear of
    // the near ridge and stood 1.0 in off it south of y = 411.248, where
    // the far ridge is not (a gap of 0.9997 in). Now it is seated on the
    // near ridge's east side and cut to the far ridge's end, y = 411.248.
    // Derivation (nodes from the solved roof's lines).
    assert_valley_top_seated_beside_a_left_out_hip(
        &frame,
        dvec2(243.98928821265162, 411.59161626867683),
        dvec2(244.9890299266105, 411.99774485847456),
    );
}

/// Seed 8470: an orthogonal outline of 20 walls with a courtyard.
#[rustfmt::skip]
const SEED_8470: [WallRow; 20] = [
    (257.7919481007918, 276.80236417636934, 0.5, 2.0),
    (312.29831097412114, 276.80236417636934, 0.5, 9.0),
    (375.3424808852651, 276.80236417636934, 0.5, 18.0),
    (494.03234800590144, 276.80236417636934, 0.5, 0.0),
    (494.03234800590144, 570.6217845527062, 0.5, 19.0),
    (740.2906711440692, 570.6217845527062, 0.5, 22.0),
    (740.2906711440692, 666.5766791817043, 0.5, 21.0),
    (740.2906711440692, 802.9442122239575, 0.5, 20.0),
    (740.2906711440692, 936.8041503540043, 0.5, 18.0),
    (494.03234800590144, 936.8041503540043, 0.5, 9.0),
    (450.84201190151407, 936.8041503540044, 0.5, 22.0),
    (409.6390558756883, 936.8041503540043, 0.5, 18.0),
    (375.3424808852651, 936.8041503540043, 0.5, 10.0),
    (375.3424808852651, 733.1347795395361, 0.5, 6.0),
    (494.03234800590144, 733.1347795395361, 0.5, 21.0),
    (494.03234800590144, 668.8071193940333, 0.5, 22.0),
    (375.3424808852651, 668.8071193940333, 0.5, 10.0),
    (375.3424808852651, 570.6217845527062, 0.5, 21.0),
    (257.7919481007918, 570.6217845527062, 0.5, 4.0),
    (257.7919481007918, 422.44318713162875, 0.5, 16.0),
];

#[rustfmt::skip]
const SEED_8470_COURTYARD: [WallRow; 4] = [
    (361.6748468615345, 565.4831838703872, 0.3333333333333333, 1.0),
    (468.63040434809596, 565.4831838703872, 0.3333333333333333, 4.0),
    (468.63040434809596, 455.88948323381436, 0.3333333333333333, 1.0),
    (361.6748468615345, 455.88948323381436, 0.3333333333333333, 10.0),
];

#[test]
fn a_valley_top_is_seated_on_its_ridge_not_cut_to_the_end_of_one_beyond() {
    let frame = framed(&SEED_8470, &[&SEED_8470_COURTYARD]);
    // The valley rises from the courtyard's north-east corner to the north
    // end of the ridge along x = 483.872 at y = 580.724. A hip of 0.21 in
    // (left out) runs from there to the west end of the ridge along
    // y = 580.899 at x = 483.755, which runs on half a rafter to
    // x = 483.005. Cut to that end, the top was cut clear of the near
    // ridge's west side, x = 483.122, and stood 0.117 in off it south of
    // the far ridge's south side, y = 580.149 (a gap of 0.1164 in). Now it
    // is seated on the near ridge's west side and cut to the far ridge's
    // south side. Derivation (nodes from the solved roof's lines).
    assert_valley_top_seated_beside_a_left_out_hip(
        &frame,
        dvec2(483.87157054277924, 580.7243500650704),
        dvec2(483.7551466412633, 580.8989859173444),
    );
}

/// Seed 9260: an orthogonal outline of 17 walls with gables, mixed pitches.
#[rustfmt::skip]
const SEED_9260: [WallRow; 17] = [
    (0.0, 131.604605058143, 1.3135104620266818, 12.0),
    (207.54637503652404, 131.604605058143, 0.3333333333333333, 14.0),
    (207.54637503652404, 0.0, 0.4166666666666667, 14.0),
    (415.0927500730481, 0.0, 1.3333333333333333, 9.0),
    (415.0927500730481, 131.604605058143, 0.8333333333333334, 7.0),
    (622.6391251095721, 131.604605058143, 0.9173881695691938, 17.0),
    (622.6391251095721, 397.52735171752204, 1.0833333333333333, 8.0),
    (415.0927500730481, 397.52735171752204, 1.297639789359674, 13.0),
    (415.092750073048, 507.87107842222406, 1.297639789359674, 21.0),
    (415.0927500730481, 557.0567839408894, 1.297639789359674, 10.0),
    (415.0927500730481, 676.6003386448165, 0.0, 7.0),
    (207.54637503652404, 676.6003386448165, 1.25, 22.0),
    (207.54637503652404, 397.52735171752204, 1.084444540760518, 8.0),
    (117.48153286732361, 397.52735171752204, 1.084444540760518, 19.0),
    (0.0, 397.52735171752204, 0.0, 1.0),
    (0.0, 312.04203925055975, 0.0, 1.0),
    (0.0, 196.14336335503975, 0.0, 9.0),
];

#[test]
fn a_valley_top_is_seated_on_a_short_ridge_not_cut_to_the_side_of_one_beside_it() {
    let frame = framed(&SEED_9260, &[]);
    // The valley rises from the inside corner at (415.093, 397.527) to the
    // west end of a ridge of 3.3 in along y = 251.797 at x = 293.430. A
    // hip of 0.096 in (left out) runs from there to the east end of the
    // ridge along y = 251.865 at x = 293.362, which runs on half a rafter
    // to x = 294.112. Cut to the far ridge's north side, y = 252.615, the
    // top was cut clear of the short ridge's north side, y = 252.547, and
    // stood 0.0675 in off it east of x = 294.112 (a gap of 0.0675 in). Now
    // it is seated on the short ridge's north side and cut to the far
    // ridge's end. (A hip ending at the far ridge's end, which stood
    // 0.0675 in off it, is stepped now: see
    // `a_hip_top_at_a_ridge_step_a_hair_aside_is_stepped_with_it`.)
    // Derivation (nodes from the solved roof's lines).
    assert_valley_top_seated_beside_a_left_out_hip(
        &frame,
        dvec2(293.4301075797923, 251.7972417687007),
        dvec2(293.3617506133659, 251.86477280258222),
    );
}

/// Seed 12402: an orthogonal outline of 10 walls with a courtyard, mixed pitches.
#[rustfmt::skip]
const SEED_12402: [WallRow; 10] = [
    (0.0, 550.7329723620073, 0.4457570957560944, 14.0),
    (509.4304958362578, 550.7329723620073, 0.1675556660429541, 20.0),
    (509.4304958362578, 413.0497292715055, 1.0, 2.0),
    (339.6203305575052, 413.0497292715055, 0.752915480835179, 10.0),
    (339.6203305575052, 275.36648618100367, 0.6653236139092433, 18.0),
    (509.4304958362578, 275.36648618100367, 1.4166666666666667, 15.0),
    (509.4304958362578, 137.68324309050183, 1.1237309382800873, 16.0),
    (339.6203305575052, 137.68324309050183, 0.16666666666666666, 7.0),
    (339.6203305575052, 0.0, 0.8333333333333334, 15.0),
    (0.0, 0.0, 0.16666666666666666, 1.0),
];

#[rustfmt::skip]
const SEED_12402_COURTYARD: [WallRow; 4] = [
    (156.8203349695298, 251.41809982576802, 1.25, 7.0),
    (260.09475226052325, 251.41809982576802, 1.1666666666666667, 9.0),
    (260.09475226052325, 367.0579182753185, 1.25, 14.0),
    (156.8203349695298, 367.0579182753185, 1.4166666666666667, 14.0),
];

#[test]
fn a_valley_top_is_seated_on_its_ridge_and_cut_to_the_end_of_one_in_line() {
    let frame = framed(&SEED_12402, &[&SEED_12402_COURTYARD]);
    // The valley rises from the courtyard's north-east corner to the north
    // end of the ridge along x = 291.287 at y = 396.171. A hip of 0.32 in
    // (left out) runs from there to the south end of the ridge along
    // x = 291.013 at y = 396.336, in line with the first but 0.274 in to
    // the west, which runs on half a rafter to y = 395.586. Cut to the far
    // ridge's west side, x = 290.263, the top was cut clear of the near
    // ridge's west side, x = 290.537, and stood 0.274 in off it south of
    // y = 395.586 (a gap of 0.2738 in). Now it is seated on the near
    // ridge's west side and cut to the far ridge's end. Derivation (nodes
    // from the solved roof's lines).
    assert_valley_top_seated_beside_a_left_out_hip(
        &frame,
        dvec2(291.28697766233313, 396.1706619836744),
        dvec2(291.0132095609181, 396.3355613770458),
    );
}

/// Every joint of piece `i` fits, by the frame's check and by parry.
fn assert_joints_of_fit(frame: &Frame, i: usize) {
    let joints: Vec<_> = frame.joints.iter().filter(|j| j.pieces.contains(&i)).collect();
    assert!(!joints.is_empty(), "{} has no joint", frame.pieces[i].label);
    for j in joints {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        let (gap, overlap, _) = parry_fit::fit(frame, j.pieces[0], j.pieces[1]);
        assert!(gap < FIT_IN && overlap < FIT_IN, "{:?}: parry {gap} / {overlap}", j.members);
    }
}

#[test]
fn a_hip_meeting_a_slanting_ridges_side_short_of_the_end_king_bears_on_the_ridge_only() {
    let frame = framed(&SEED_2504, &[]);
    // Read from the solve: the ridge runs from its west end at
    // (52.749, 218.456) to the south-east at 45 degrees. The hip between
    // the north plane (wall 1) and the plane of the tiny wall 4 comes up
    // to that end from (80.261, 242.991); the north plane's king runs
    // square to the north wall along x = 52.749 and is cut back along the
    // ridge's end, a 45 degree face, so its east side (x = 53.499) starts
    // only at y = 220.27. The hip reaches the ridge's north-east side
    // before it: cut to the king's side, its face there met nothing, 1.14
    // in short of the king's slanting end, and it ran on into the ridge's
    // side with no corner of either inside the other.
    let node = dvec2(52.74922917126327, 218.45623563843222);
    let hip = piece_ending_at(&frame, MemberKind::Hip, 1, node).unwrap_or_else(|| panic!("the hip"));
    assert!(frame.pieces[hip].plan_line[0].distance(dvec2(80.26099758228936, 242.99139061804286)) < 0.01);
    let king =
        piece_ending_at(&frame, MemberKind::KingCommon, 0, dvec2(52.749229171263295, 267.9383450038189))
            .unwrap_or_else(|| panic!("the north king"));
    let ridge = frame
        .pieces
        .iter()
        .position(|p| p.kind == MemberKind::Ridge && p.plan_line.iter().any(|q| q.distance(node) < 1.5))
        .unwrap_or_else(|| panic!("the ridge"));
    assert!(frame.joints.iter().any(|j| j.pieces == [hip, ridge]), "the hip bears on the ridge");
    assert!(!frame.joints.iter().any(|j| j.pieces == [hip, king]), "the hip is cut to the king");
    assert_joints_of_fit(&frame, hip);
    // Nor do the hip and the king, or the hip and the ridge, share wood.
    let pair = |a: usize, b: usize| {
        (a == hip && (b == king || b == ridge)) || (b == hip && (a == king || a == ridge))
    };
    let (depth, a, b, unhulled) = parry_fit::interference_where_measurable(&frame, |a, b| !pair(a, b));
    assert!(![hip, king, ridge].iter().any(|&i| unhulled.contains(&frame.pieces[i].label)));
    assert!(depth < FIT_IN, "{a} and {b} share {depth} in");
}

/// Seed 13610: a plan of wings at one pitch with tiny corners cut off at
/// 45 degrees, its main ridge a hair (4.7e-7 rad) off square to the south
/// wall.
#[rustfmt::skip]
const SEED_13610: [WallRow; 26] = [
    (0.0, 136.43843463776187, 0.5833333333333334, 17.0),
    (89.9599911591671, 136.43843463776187, 0.5833333333333334, 12.0),
    (269.86868983570656, 136.43843463776187, 0.5833333333333334, 5.0),
    (269.8799734775013, 136.44971827955663, 0.5833333333333334, 2.0),
    (269.8799734775013, 320.43352148602, 0.5833333333333334, 21.0),
    (303.09010078503997, 320.43352148602, 0.5833333333333334, 18.0),
    (303.1002264847355, 320.43352148602, 0.5833333333333334, 8.0),
    (328.04336710409837, 320.43352148602, 0.5833333333333334, 22.0),
    (359.8333985915513, 320.43352148602, 0.5833333333333334, 19.0),
    (359.8399646366684, 320.4400875311371, 0.5833333333333334, 18.0),
    (359.8399646366684, 533.0269758883798, 0.5833333333333334, 11.0),
    (359.8399646366684, 533.0377829757064, 0.5833333333333334, 16.0),
    (359.8399646366684, 672.5071938194881, 0.5833333333333334, 18.0),
    (269.8859609490483, 672.5071938194881, 0.5833333333333334, 10.0),
    (269.8799734775013, 672.5012063479411, 0.5833333333333334, 14.0),
    (269.8799734775013, 585.4406345292971, 0.5833333333333334, 3.0),
    (269.86875361437035, 585.4294146661662, 0.5833333333333334, 21.0),
    (236.93262117996701, 585.4294146661662, 0.5833333333333334, 8.0),
    (217.44579565029807, 585.4294146661662, 0.5833333333333334, 6.0),
    (179.92684086838491, 585.4294146661662, 0.5833333333333334, 22.0),
    (179.9199823183342, 585.4362732162169, 0.5833333333333334, 15.0),
    (179.9199823183342, 672.5071938194881, 0.5833333333333334, 5.0),
    (89.9599911591671, 672.5071938194881, 0.5833333333333334, 12.0),
    (89.9599911591671, 585.4361058893234, 0.5833333333333334, 21.0),
    (89.95329993600997, 585.4294146661662, 0.5833333333333334, 12.0),
    (0.0, 585.4294146661662, 0.5833333333333334, 2.0),
];

#[test]
fn a_hip_whose_top_corner_meets_the_kings_a_millionth_off_fits() {
    let frame = framed(&SEED_13610, &[]);
    // Read from the solve: the main ridge's south hip end at
    // (134.940, 271.378), with the south plane's king along x = 134.940
    // cut to the ridge's end, a face 4.7e-7 rad off square. The hip from
    // the south-east corner is cut to that king's east side and to the
    // east plane's king; its top corner, worked out from its own cuts,
    // lies 1.3e-6 in outside the king's end, and the line square to the
    // king's side from it grazed that end and read 0.60 in of gap.
    let node = dvec2(134.9399030753007, 271.37833771306254);
    let hip = frame
        .pieces
        .iter()
        .position(|p| {
            p.kind == MemberKind::Hip
                && p.plan_line[1].distance(node) < 0.01
                && p.plan_line[0].distance(dvec2(269.860711096077, 136.45769701918618)) < 0.01
        })
        .unwrap_or_else(|| panic!("the south-east hip"));
    let king =
        piece_ending_at(&frame, MemberKind::KingCommon, 0, dvec2(134.9399030753007, 136.43843463776187))
            .unwrap_or_else(|| panic!("the south king"));
    assert!(frame.joints.iter().any(|j| j.pieces == [hip, king]), "the hip bears on the south king");
    assert_joints_of_fit(&frame, hip);
    assert!(
        !frame
            .members
            .iter()
            .any(|m| m.warnings.iter().any(|w| matches!(w, FramingWarning::JointDoesNotFit { .. })))
    );
}

/// Seed 4512: a plan of wings at mixed pitches round a courtyard, one gable
/// end (wall 6).
#[rustfmt::skip]
const SEED_4512: [WallRow; 14] = [
    (0.0, 869.978686287212, 0.8858918476544412, 11.0),
    (0.0, 975.4051162056912, 0.8858918476544412, 12.0),
    (0.0, 1113.0371410542987, 0.6666666666666666, 3.0),
    (0.016953996966513337, 1113.0540950512652, 0.5, 11.0),
    (198.97776788179078, 1113.0540950512652, 0.9166666666666666, 17.0),
    (198.97776788179078, 1302.7026913652426, 0.48560588308562497, 20.0),
    (397.95553576358157, 1302.7026913652426, 0.16666666666666666, 0.0),
    (397.95553576358157, 869.978686287212, 1.1666666666666667, 4.0),
    (198.97776788179078, 869.978686287212, 1.430822354248795, 9.0),
    (198.97776788179078, 643.176176786709, 1.0, 18.0),
    (397.95553576358157, 643.176176786709, 1.5, 7.0),
    (397.95553576358157, 558.9858553550163, 1.5, 4.0),
    (397.95553576358157, 442.6143875180827, 1.5, 20.0),
    (0.0, 442.6143875180827, 0.8858918476544412, 11.0),
];

#[rustfmt::skip]
const SEED_4512_COURTYARD: [WallRow; 4] = [
    (236.4331786099398, 935.7241269937697, 1.1724154656251942, 23.0),
    (297.7095103073971, 935.7241269937697, 1.1513401583820837, 18.0),
    (297.7095103073971, 1004.6780514198897, 0.8333333333333334, 18.0),
    (236.4331786099398, 1004.6780514198897, 0.25, 13.0),
];

#[test]
fn a_ridges_hip_end_is_cut_back_to_a_hip_passing_just_beyond_it() {
    let frame = framed(&SEED_4512, &[&SEED_4512_COURTYARD]);
    // Read from the solve: the ridge along x = 172.744 has its north hip
    // end at (172.744, 902.152), and runs half a rafter past it, to
    // y = 902.902, flush with the side kings. The hip from the courtyard's
    // corner ridge end at (310.386, 923.276) to (63.014, 888.110) passes
    // 1.55 in north of that node, its south side about 0.06 in short of
    // the ridge's north-west corner (172.744 - 0.75, 902.902): the corner
    // ran 0.056 in into the hip's side. The ridge's end is now cut back to
    // the hip's side where it runs into it and bears on it there.
    let ridge = frame
        .pieces
        .iter()
        .position(|p| {
            p.kind == MemberKind::Ridge
                && p.plan_line.iter().any(|q| q.distance(dvec2(172.744, 902.902)) < 0.01)
        })
        .unwrap_or_else(|| panic!("the ridge ending at y = 902.902"));
    let hip = frame
        .pieces
        .iter()
        .position(|p| {
            p.kind == MemberKind::Hip
                && p.plan_line[0].distance(dvec2(310.3859779795172, 923.2755311459136)) < 0.01
                && p.plan_line[1].distance(dvec2(63.01400038556836, 888.1099570460024)) < 0.01
        })
        .unwrap_or_else(|| panic!("the hip passing by"));
    let joint = frame
        .joints
        .iter()
        .find(|j| j.pieces == [ridge, hip])
        .unwrap_or_else(|| panic!("the ridge's end bears on the hip"));
    assert!(joint.max_gap < FIT_IN && joint.max_overlap < FIT_IN, "{joint:?}");
    for j in frame.joints.iter().filter(|j| j.pieces.contains(&hip) || j.pieces[0] == ridge) {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
    }
    let pair = |a: usize, b: usize| (a == hip && b == ridge) || (a == ridge && b == hip);
    let (depth, a, b, _) = parry_fit::interference_where_measurable(&frame, |a, b| !pair(a, b));
    assert!(depth < FIT_IN, "{a} and {b} share {depth} in");
}

/// The ends of the ridge of `outer`'s solved roof whose ends lie within
/// 0.01 in of `a` and `b` (either way round): the exact nodes, read from
/// the outline's own geometry.
fn solved_ridge(outer: &[WallRow], courtyards: &[&[WallRow]], a: DVec2, b: DVec2) -> [DVec2; 2] {
    solved_line(outer, courtyards, RoofLineKind::Ridge, a, b)
}

/// The plan ends, as solved, of the roof line of `kind` whose ends are
/// within 0.01 in of `a` and `b` (either way round).
fn solved_line(
    outer: &[WallRow],
    courtyards: &[&[WallRow]],
    kind: RoofLineKind,
    a: DVec2,
    b: DVec2,
) -> [DVec2; 2] {
    let o = Outline::new(walls(outer), courtyards.iter().map(|c| walls(c)).collect())
        .unwrap_or_else(|e| panic!("outline: {e}"));
    let roof = Roof::solve(&o).unwrap_or_else(|e| panic!("solve: {e}"));
    roof.lines
        .iter()
        .filter(|l| l.kind == kind)
        .map(|l| [l.from.truncate(), l.to.truncate()])
        .find(|[p, q]| {
            (p.distance(a) < 0.01 && q.distance(b) < 0.01) || (p.distance(b) < 0.01 && q.distance(a) < 0.01)
        })
        .unwrap_or_else(|| panic!("no {kind:?} from {a} to {b}"))
}

/// Two ridges of the solved roof run parallel less than a ridge board's
/// thickness apart, `short` (its centre line's ends) beside the longer
/// `kept` along its whole length, a sliver of a plane between them. Their
/// boards overlapped along the whole common length. Asserts that one
/// board is framed there: no ridge piece lies along `short`'s centre
/// line, the kept ridge's pieces beside it carry the warning with the
/// left-out ridge's length and the distance between the two (both read
/// from the two centre lines), every rafter that came up to `short` from
/// its far side (its plan line crossing `short`'s centre line within its
/// stretch) now ends on `kept`'s centre line and bears on the kept ridge
/// with the warning, every hip or valley ending at `short`'s ends carries
/// the warning and its top's joints on the ridge or a king fit, no two of the ridges, kings and commons share wood (by
/// parry), and every joint cut to a kept ridge piece or by it fits by the
/// frame's own check and by parry. Returns the rafters moved.
fn assert_ridge_left_out_beside(frame: &Frame, kept: [DVec2; 2], short: [DVec2; 2]) -> usize {
    let t = FramingSettings::default().ridge.thickness_in;
    let dir = (kept[1] - kept[0]).normalize();
    let across = |p: DVec2| (p - kept[0]).perp_dot(dir);
    let along = |p: DVec2| (p - kept[0]).dot(dir);
    let apart = across((short[0] + short[1]) / 2.0);
    let length = short[0].distance(short[1]);
    assert!(apart.abs() < t, "the two ridges lie {apart} in apart");
    let (lo, hi) = (along(short[0]).min(along(short[1])), along(short[0]).max(along(short[1])));
    let on_kept = |p: DVec2| across(p).abs() < 1e-6;
    let ridges: Vec<usize> =
        (0..frame.pieces.len()).filter(|&i| frame.pieces[i].kind == MemberKind::Ridge).collect();
    for &i in &ridges {
        let [a, b] = frame.pieces[i].plan_line;
        let beside = along(a).max(along(b)) > lo && along(a).min(along(b)) < hi;
        assert!(
            !(beside && (across(a) - apart).abs() < 1e-3 && (across(b) - apart).abs() < 1e-3),
            "{} lies along the ridge beside",
            frame.pieces[i].label
        );
    }
    let warned = |i: usize, ridge: &str| {
        frame.members.iter().filter(|m| m.label == frame.pieces[i].label).any(|m| {
            m.warnings.iter().any(|w| {
                matches!(w, FramingWarning::RidgeBesideLeftOut { ridge: r, length_in, apart_in, .. }
                    if r == ridge && (length_in - length).abs() < 1e-9 && (apart_in - apart.abs()).abs() < 1e-9)
            })
        })
    };
    let kept_pieces: Vec<usize> = ridges
        .iter()
        .copied()
        .filter(|&i| frame.pieces[i].plan_line.iter().all(|&p| on_kept(p)))
        .filter(|&i| {
            let [a, b] = frame.pieces[i].plan_line;
            along(a).max(along(b)) > lo && along(a).min(along(b)) < hi
        })
        .collect();
    assert!(!kept_pieces.is_empty(), "no ridge piece on the kept ridge's line");
    for &i in &kept_pieces {
        assert!(warned(i, &frame.pieces[i].label), "{} has no warning", frame.pieces[i].label);
    }
    let fits = |j: &pitchframe_geometry::framing::Joint| {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        let (gap, overlap, _) = parry_fit::fit(frame, j.pieces[0], j.pieces[1]);
        assert!(gap < FIT_IN && overlap < FIT_IN, "{:?}: parry {gap} / {overlap}", j.members);
    };
    let rafter = |k: MemberKind| {
        matches!(
            k,
            MemberKind::Common
                | MemberKind::KingCommon
                | MemberKind::HipJack
                | MemberKind::ValleyJack
                | MemberKind::CrippleJack
        )
    };
    let mut moved = 0;
    for (i, p) in frame.pieces.iter().enumerate().filter(|(_, p)| rafter(p.kind)) {
        let [foot, top] = p.plan_line;
        // From `short`'s far side, across its centre line within its stretch.
        let far_side = across(foot) * apart > 0.0 && across(foot).abs() > apart.abs();
        let s = (across(foot) - apart) / (across(foot) - across(top));
        let crossing = foot + (top - foot) * s;
        let within = along(crossing) > lo - 1e-6 && along(crossing) < hi + 1e-6;
        if !(far_side && (0.0..=1.0 + 1e-9).contains(&s) && within) {
            continue;
        }
        moved += 1;
        assert!(on_kept(top), "{} ends {} in off the kept ridge", p.label, across(top));
        let joint = frame
            .joints
            .iter()
            .find(|j| j.pieces[0] == i && kept_pieces.contains(&j.pieces[1]))
            .unwrap_or_else(|| panic!("{} does not bear on the kept ridge", p.label));
        assert!(warned(i, &joint.members[1]), "{} has no warning", p.label);
    }
    assert!(moved > 0, "no rafter came up to the left-out ridge");
    for (i, p) in frame.pieces.iter().enumerate() {
        let at_short = p.plan_line.iter().any(|q| short.iter().any(|n| n.distance(*q) < 1e-6));
        if matches!(p.kind, MemberKind::Hip | MemberKind::Valley) && at_short {
            let ridge = &frame.pieces[kept_pieces[0]].label;
            assert!(kept_pieces.len() > 1 || warned(i, ridge), "{} has no warning", p.label);
            // Its top's joints, on the kept ridge or a king there.
            let at_top = |j: &&pitchframe_geometry::framing::Joint| {
                j.pieces[0] == i
                    && matches!(frame.pieces[j.pieces[1]].kind, MemberKind::Ridge | MemberKind::KingCommon)
            };
            for j in frame.joints.iter().filter(at_top) {
                fits(j);
            }
        }
    }
    let framed_square =
        |k: MemberKind| matches!(k, MemberKind::Ridge | MemberKind::KingCommon | MemberKind::Common);
    assert_no_wood_shared(frame, |a, b| framed_square(a) && framed_square(b));
    for j in frame.joints.iter().filter(|j| j.pieces.iter().any(|i| kept_pieces.contains(i))) {
        fits(j);
    }
    moved
}

/// Seed 4860: a block at 2/12 round a courtyard of 6.3 x 4.8 in at 5/12.
/// The courtyard's west plane rises to a ridge of 25.2 in along
/// x = 71.229, 0.968 in east of the block's ridge along x = 70.261 (173.2
/// in), with a sliver of the block's east plane between the two and no
/// hip between their ends.
#[rustfmt::skip]
const SEED_4860: [WallRow; 6] = [
    (43.878250085678026, 0.0, 0.16666666666666666, 22.0),
    (96.64417825215165, 0.0, 0.16666666666666666, 10.0),
    (96.64417825215165, 112.7692620035609, 0.16666666666666666, 14.0),
    (96.64417825215165, 225.9543167985862, 0.16666666666666666, 10.0),
    (43.878250085678026, 225.9543167985862, 0.16666666666666666, 6.0),
    (43.878250085678026, 92.49243445879353, 0.16666666666666666, 16.0),
];

// The draw's overhangs 4, 15, 2, 17 in cut to 1, 3, 2, 3 in: as
// drawn the courtyard is too small for them, and refused.
#[rustfmt::skip]
const SEED_4860_COURTYARD: [WallRow; 4] = [
    (81.39518106115747, 142.36572248823467, 0.4166666666666667, 1.0),
    (87.7365266391302, 142.36572248823467, 0.4166666666666667, 3.0),
    (87.7365266391302, 137.51835041887495, 0.4166666666666667, 2.0),
    (81.39518106115747, 137.51835041887495, 0.4166666666666667, 3.0),
];

#[test]
fn a_ridge_beside_a_longer_one_closer_than_its_thickness_is_left_out() {
    // The short ridge's two kings (from the east wall along y = 127.352
    // and y = 152.532) and the two valleys from the courtyard's west
    // corners came up to its ends; the kings read a gap of 0.968 in from
    // their top corner above the lower ridge to the block ridge's face
    // behind it. Now the kings run on across the sliver to the block
    // ridge's east side, the valleys are cut to it, and one ridge board
    // is framed. Derivation (nodes from the solved roof's lines).
    let kept =
        solved_ridge(&SEED_4860, &[&SEED_4860_COURTYARD], dvec2(70.261, 199.571), dvec2(70.261, 26.383));
    let short =
        solved_ridge(&SEED_4860, &[&SEED_4860_COURTYARD], dvec2(71.229, 127.352), dvec2(71.229, 152.532));
    let frame = framed(&SEED_4860, &[&SEED_4860_COURTYARD]);
    let moved = assert_ridge_left_out_beside(&frame, kept, short);
    // The two kings at the short ridge's ends (no common lies between).
    assert_eq!(moved, 2);
}

/// Seed 15026: an orthogonal outline of 14 walls, mixed pitches. The
/// ridge along x = 89.044 (69.4 in) lies 0.417 in east of the ridge along
/// x = 88.627 (95.6 in), a sliver of the plane of wall 6 between them; a
/// hip of 0.42 in (left out) joins their south ends.
#[rustfmt::skip]
const SEED_15026: [WallRow; 14] = [
    (0.0, 64.65922294647348, 0.4166666666666667, 9.0),
    (35.65662511526169, 64.65922294647348, 0.4166666666666667, 3.0),
    (64.70672631624858, 64.65922294647348, 1.1858694425955194, 17.0),
    (64.70672631624858, 0.0, 0.9683456193314393, 1.0),
    (194.12017894874572, 0.0, 0.26930164116813726, 18.0),
    (194.12017894874572, 64.65922294647348, 0.8333333333333334, 1.0),
    (258.8269052649943, 64.65922294647348, 0.16666666666666666, 17.0),
    (258.8269052649943, 674.7998764235138, 0.25, 1.0),
    (229.33952411275106, 674.7998764235138, 0.25, 20.0),
    (194.12017894874572, 674.7998764235138, 1.4173888674222772, 6.0),
    (194.12017894874572, 480.86903122264255, 0.6666666666666666, 18.0),
    (129.41345263249715, 480.86903122264255, 0.8333333333333334, 14.0),
    (129.41345263249715, 193.01358090625266, 0.4166666666666667, 13.0),
    (0.0, 193.01358090625266, 0.9166666666666666, 8.0),
];

#[test]
fn ridges_side_by_side_joined_by_a_left_out_hip_are_framed_as_one() {
    // The end kings of the two south ends, both from the south wall along
    // x = 88.627 and x = 89.044, overlapped each other by 1.5 - 0.417 =
    // 1.083 in, and the kept ridge's king ran 0.072 in into the short
    // ridge's board (the joint KC on R read). The short ridge's king gives
    // way, the kept ridge's stands in for it under the hip from the south
    // east corner, and the short ridge's other members (kings from the
    // east wall, valley jacks, commons, a valley and a hip at its north
    // end) are cut to the kept ridge's east side. Derivation (nodes from
    // the solved roof's lines).
    let kept = solved_ridge(&SEED_15026, &[], dvec2(88.627, 29.294), dvec2(88.627, 124.934));
    let short = solved_ridge(&SEED_15026, &[], dvec2(89.044, 98.616), dvec2(89.044, 29.222));
    let frame = framed(&SEED_15026, &[]);
    assert_ridge_left_out_beside(&frame, kept, short);
    // The hip from the south-east corner (194.120, 0) to the short ridge's
    // south end bears on the kept ridge's end king from the south wall.
    let hip = piece_ending_at(&frame, MemberKind::Hip, 1, short[1]).unwrap_or_else(|| panic!("the hip"));
    let king = piece_ending_at(&frame, MemberKind::KingCommon, 0, dvec2(kept[0].x, 0.0))
        .unwrap_or_else(|| panic!("the kept ridge's end king"));
    let joint =
        frame.joints.iter().find(|j| j.pieces == [hip, king]).unwrap_or_else(|| panic!("hip on king"));
    assert!(joint.max_gap < FIT_IN && joint.max_overlap < FIT_IN, "{joint:?}");
}

/// Seed 5430: a block at 3/12 round a courtyard at 16/12 (its overhangs
/// cut to 4 to 10 in here from the draw's 4 to 18 in). South of the courtyard a ridge of 6.0 in along
/// y = 152.542 lies 1.170 in north of the block's ridge along y = 151.373
/// (56.6 in); a hip of 1.65 in (left out) joins their west ends.
#[rustfmt::skip]
const SEED_5430: [WallRow; 4] = [
    (69.19766537044362, 110.49412428008895, 0.25, 19.0),
    (207.59299611133085, 110.49412428008895, 0.25, 17.0),
    (207.59299611133085, 192.25127235480304, 0.25, 17.0),
    (69.19766537044362, 192.25127235480304, 0.25, 2.0),
];

// The draw's overhangs 12, 18, 18, 4 in cut to 6, 10, 6, 4 in: as
// drawn the courtyard is too small for them, and refused.
#[rustfmt::skip]
const SEED_5430_COURTYARD: [WallRow; 4] = [
    (92.96439613355592, 172.53578076729542, 1.3333333333333333, 6.0),
    (107.47938813872169, 172.53578076729542, 1.3333333333333333, 10.0),
    (107.47938813872169, 159.98774770425865, 1.3333333333333333, 6.0),
    (92.96439613355592, 159.98774770425865, 1.3333333333333333, 4.0),
];

#[test]
fn members_at_a_left_out_ridges_ends_are_cut_back_to_the_kings_running_past() {
    // The short ridge's kings from the north wall (x = 108.907 and
    // 114.925) and from the west wall (y = 152.542) overlapped the block
    // ridge's kings beside them (x = 110.076, y = 151.373) by 1.5 - 1.170
    // = 0.330 in (the joints KC on R read that much). Now the short
    // ridge's kings at its west end give way and the one at its east end
    // runs on across the sliver to the block ridge's north side at
    // y = 152.123, past the node where the courtyard's south-east valley
    // and the hip from the courtyard ridge end; that valley crosses it
    // there, and the hip from the west runs on along the block ridge's
    // side into its king at x = 110.076, with no corner of either inside
    // the other. Both are cut back to the king's side. Derivation (nodes
    // from the solved roof's lines).
    let rows = (&SEED_5430[..], &[&SEED_5430_COURTYARD[..]][..]);
    let kept = solved_ridge(rows.0, rows.1, dvec2(166.714, 151.373), dvec2(110.076, 151.373));
    let short = solved_ridge(rows.0, rows.1, dvec2(114.925, 152.542), dvec2(108.907, 152.542));
    let frame = framed(rows.0, rows.1);
    assert_ridge_left_out_beside(&frame, kept, short);
    let king = |k: MemberKind| k == MemberKind::KingCommon;
    let hip_or_valley = |k: MemberKind| matches!(k, MemberKind::Hip | MemberKind::Valley);
    assert_no_wood_shared(&frame, |a, b| (king(a) && hip_or_valley(b)) || (hip_or_valley(a) && king(b)));
    for node in short {
        for kind in [MemberKind::Hip, MemberKind::Valley] {
            if let Some(i) = piece_ending_at(&frame, kind, 1, node) {
                let on_king = frame
                    .joints
                    .iter()
                    .filter(|j| j.pieces[0] == i && frame.pieces[j.pieces[1]].kind == MemberKind::KingCommon);
                assert!(on_king.count() > 0, "{} bears on no king", frame.pieces[i].label);
            }
        }
    }
}

/// Seed 13772: a block at 12/12 with a wing south (walls 2 to 4) and
/// gables east and north-west.
#[rustfmt::skip]
const SEED_13772: [WallRow; 13] = [
    (0.0, 73.12846420512982, 1.0, 14.0),
    (169.85153594188216, 73.12846420512982, 1.0, 9.0),
    (169.85153594188216, 0.0, 1.0, 0.0),
    (451.3824409839607, 0.0, 1.0, 21.0),
    (451.3824409839607, 73.12846420512982, 1.0, 22.0),
    (581.0178870108425, 73.12846420512982, 0.0, 2.0),
    (581.0178870108425, 516.2737678183695, 1.0, 24.0),
    (451.3824409839607, 516.2737678183695, 1.0, 18.0),
    (451.3824409839607, 354.28667281060825, 1.0, 17.0),
    (451.37230811584567, 354.27653994249323, 1.0, 18.0),
    (169.85153594188216, 354.27653994249323, 0.0, 21.0),
    (169.85153594188216, 516.2737678183695, 0.0, 5.0),
    (0.0, 516.2737678183695, 1.0, 14.0),
];

#[test]
fn both_ridge_ends_beside_a_king_at_a_t_are_cut_back_to_its_sides() {
    let frame = framed(&SEED_13772, &[]);
    // Read from the solve: the main ridge along y = 213.703 comes in two in
    // line, one ending at x = 310.426 and one at x = 310.808, and the
    // wing's ridge along x = 310.617 comes up from the south to
    // (310.617, 213.511), hips of 0.27 in (left out) running from there to
    // the two ends. The king from the north wall along x = 310.617 runs
    // down between the two ends to the wing ridge's end: its board, x =
    // 309.867 to 311.367, covers both. The west ridge's end was cut back to
    // the king's west side; the east one's was not (a valley jack's stub of
    // 1.19 in, between the valley and that ridge at x = 312, too short to
    // cut and left out, counted as a rafter that would lose its bearing),
    // and its corner lay 0.19 in inside the king. Both are now cut back to
    // the king's sides and bear on it.
    let king =
        piece_ending_at(&frame, MemberKind::KingCommon, 0, dvec2(310.6169884629214, 354.27653994249323))
            .unwrap_or_else(|| panic!("the king from the north wall"));
    let half = FramingSettings::default().rafter.thickness_in / 2.0;
    for (end_x, side) in [(310.42557381056383, -1.0), (310.808403115279, 1.0)] {
        let ridge = frame
            .pieces
            .iter()
            .position(|p| {
                p.kind == MemberKind::Ridge
                    && p.plan_line.iter().any(|q| q.distance(dvec2(end_x, 213.7025020738115)) < 0.01)
            })
            .unwrap_or_else(|| panic!("the ridge ending at x = {end_x}"));
        let nearest = frame.pieces[ridge]
            .solid
            .vertices()
            .map(|v| (v.x - 310.6169884629214) * side)
            .fold(f64::INFINITY, f64::min);
        assert!(
            nearest > half - 1e-6,
            "{} reaches {nearest} in from the king's line",
            frame.pieces[ridge].label
        );
        let joint = frame
            .joints
            .iter()
            .find(|j| j.pieces == [ridge, king])
            .unwrap_or_else(|| panic!("{} bears on the king", frame.pieces[ridge].label));
        assert!(joint.max_gap < FIT_IN && joint.max_overlap < FIT_IN, "{joint:?}");
    }
    assert_joints_of_fit(&frame, king);
}

/// Seed 25797: a star of five walls round a courtyard set on the slant,
/// mixed pitches.
#[rustfmt::skip]
const SEED_25797: [WallRow; 5] = [
    (70.95811519514001, -100.30323345289321, 0.2569227314330342, 5.0),
    (155.76910716130155, 88.8052889646289, 1.3333333333333333, 4.0),
    (155.7666099956219, 88.81027527852625, 0.25, 13.0),
    (-48.5724932200594, 134.6391823733638, 1.25, 21.0),
    (-161.86868820728597, -115.00554495981503, 1.4608196542423426, 2.0),
];

#[rustfmt::skip]
const SEED_25797_COURTYARD: [WallRow; 4] = [
    (35.22130948404717, 56.87032637490936, 0.5833333333333334, 4.0),
    (77.32189397184848, 97.55326825069974, 0.25, 5.0),
    (125.25412437710904, 47.950785666560755, 0.4166666666666667, 9.0),
    (83.15353988930772, 7.267843790770371, 0.3333333333333333, 15.0),
];

/// The hips starting at `node`, the top of `valley`, each with the corners
/// of its foot's face on the valley's side (plumb, square to the valley
/// and half its thickness off its line).
fn feet_on_valley_side(frame: &Frame, valley: usize, node: DVec2) -> Vec<(usize, Vec<glam::DVec3>)> {
    let [foot, top] = frame.pieces[valley].plan_line;
    let u = (top - foot).normalize();
    let half = 1.5 / 2.0;
    frame
        .pieces
        .iter()
        .enumerate()
        .filter(|(_, p)| p.kind == MemberKind::Hip && p.plan_line[0].distance(node) < 0.01)
        .map(|(i, p)| {
            let corners = p
                .solid
                .faces()
                .filter(|f| f.normal.z.abs() < 1e-9 && f.normal.truncate().dot(u).abs() < 1e-9)
                .filter(|f| {
                    f.vertices.iter().all(|v| ((v.truncate() - node).perp_dot(u).abs() - half).abs() < 1e-6)
                })
                .flat_map(|f| f.vertices.iter().copied())
                .collect();
            (i, corners)
        })
        .collect()
}

#[test]
fn hips_rising_from_a_valleys_top_bear_on_its_sides_their_feet_full_width() {
    let frame = framed(&SEED_25797, &[&SEED_25797_COURTYARD]);
    // Read from the solve: the valley over the courtyard's corner
    // (125.254, 47.951) rises 1.46 in to a node at (131.900, 49.492) with
    // no ridge, where two hips start: one at 140.7 degrees in plan from
    // the valley's line, turned back beside it, the other at 86.3 degrees.
    // Each foot is cut to the valley's side. With the valley's top cut
    // plumb at the node, the first foot ran 0.27 in past it and the second
    // 0.80 in, in the air. The valley now runs on, plumb and square, to
    // the farthest corner of the feet, which the hips' lines give: a hip
    // at plan angle a from the valley, both 1-1/2 in thick, crosses the
    // valley's side (0.75 + 0.75 cos a) / sin a past the node (derived in
    // plan, 0.80 in at 86.3 degrees).
    let node = dvec2(131.899_606_835_954_87, 49.491_757_256_294_33);
    let valley_foot = dvec2(125.254_124_377_109_04, 47.950_785_666_560_755);
    let u = (node - valley_foot).normalize();
    let valley = piece_ending_at(&frame, MemberKind::Valley, 1, node).expect("the valley up to the node");
    let along = |v: glam::DVec3| (v.truncate() - node).dot(u);
    let valley_top = frame.pieces[valley].solid.vertices().map(along).fold(f64::NEG_INFINITY, f64::max);
    let feet = feet_on_valley_side(&frame, valley, node);
    assert_eq!(feet.len(), 2, "two hips start at the valley's top");
    let mut farthest = f64::NEG_INFINITY;
    let mut expected = f64::NEG_INFINITY;
    for (hip, corners) in &feet {
        assert!(corners.len() >= 3, "{} has a face on the valley's side", frame.pieces[*hip].label);
        for &c in corners {
            assert!(
                along(c) <= valley_top + 1e-6,
                "{} hangs {} in past the valley",
                frame.pieces[*hip].label,
                along(c) - valley_top
            );
            farthest = farthest.max(along(c));
        }
        let [a, b] = frame.pieces[*hip].plan_line;
        let cos_a = (b - a).normalize().dot(u);
        let sin_a = (1.0 - cos_a * cos_a).sqrt();
        expected = expected.max((0.75 + 0.75 * cos_a) / sin_a);
        let joint =
            frame.joints.iter().find(|j| j.pieces == [*hip, valley]).expect("the hip bears on the valley");
        assert!(joint.max_gap < FIT_IN && joint.max_overlap < FIT_IN, "{joint:?}");
        let (gap, overlap, mating) = parry_fit::fit(&frame, *hip, valley);
        assert!(mating >= 1 && gap < FIT_IN && overlap < FIT_IN, "parry {gap} / {overlap}");
    }
    assert!((farthest - valley_top).abs() < 1e-6, "the top runs {} in past the feet", valley_top - farthest);
    assert!((valley_top - expected).abs() < 1e-6, "top {valley_top} in past the node, {expected} derived");
    assert!((expected - 0.80).abs() < 0.005, "{expected}");
    // The valley's top face is plumb and square to its line.
    let top_face = frame.pieces[valley]
        .solid
        .faces()
        .find(|f| f.vertices.iter().all(|&v| (along(v) - valley_top).abs() < 1e-6))
        .expect("the valley's top face");
    assert!(top_face.normal.z.abs() < 1e-9 && top_face.normal.truncate().dot(u) > 1.0 - 1e-9);
    // The hip turned back beside the valley runs 3.07 in from the
    // courtyard wall's line at its foot (its centre 3.51 in), inside the
    // 3-1/2 in plate: it is cut level with the plate's top there and
    // flagged, as a hip low beside a wall is, and no corner of it is left
    // below the plate.
    let (back, _) = feet
        .iter()
        .find(|(h, _)| (frame.pieces[*h].plan_line[1] - node).normalize().dot(u) < -0.7)
        .expect("the hip turned back");
    let label = &frame.pieces[*back].label;
    assert!(
        frame
            .warnings
            .iter()
            .any(|w| matches!(w, FramingWarning::HipCutLevelAtPlate { label: l, .. } if l == label)),
        "{label} is flagged as cut level at the plate"
    );
    let lowest = frame.pieces[*back].solid.vertices().map(|v| v.z).fold(f64::INFINITY, f64::min);
    assert!(lowest > -1e-6, "{label} reaches {lowest} in below the plate");
    for j in &frame.joints {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
    }
}

/// Seed 36779: a star of 23 walls round a courtyard, mixed pitches.
#[rustfmt::skip]
const SEED_36779: [WallRow; 23] = [
    (7.516337615713791, 107.74757188321048, 0.5, 5.0),
    (-15.287899438816682, 123.96990286886701, 1.5, 14.0),
    (-15.291394511257032, 123.97239307227666, 0.16666666666666666, 1.0),
    (-35.873241010490155, 138.65974695310445, 0.9166666666666666, 18.0),
    (-35.87930279270809, 138.65778053656604, 0.16666666666666666, 16.0),
    (-58.02243811272491, 72.64126153520996, 0.6666666666666666, 7.0),
    (-94.56963531470322, 49.839565022118485, 0.6666666666666666, 22.0),
    (-136.21282007555052, -17.258614011307717, 0.9166666666666666, 13.0),
    (-99.0072882208938, -68.91764694351629, 0.3333333333333333, 20.0),
    (-79.93409812624994, -82.29009126717968, 0.25, 9.0),
    (-29.846226648294415, -137.74346136708496, 0.5, 14.0),
    (35.8484479449025, -109.20602760151262, 1.3333333333333333, 5.0),
    (67.7787905292464, -126.24284373307349, 0.7097374292110921, 15.0),
    (114.70426768782549, -45.1414210583333, 0.4166666666666667, 23.0),
    (122.49890902163114, -32.75951615441925, 0.9166666666666666, 14.0),
    (130.66262295398533, -19.938808141315917, 1.456025234506196, 13.0),
    (121.90931834808983, 2.79542678313924, 0.5036643346658161, 24.0),
    (102.66597009051637, 52.90399469828704, 0.5, 18.0),
    (102.66465913759743, 52.910396599604205, 0.16666666666666666, 2.0),
    (100.55421688074989, 109.46450329746304, 0.5667897697489246, 8.0),
    (100.5513240487616, 109.469533843111, 1.3333333333333333, 16.0),
    (87.0259188066375, 118.03142013379878, 0.6676095293629788, 15.0),
    (65.09351681682986, 131.67301126466288, 1.25, 18.0),
];

#[rustfmt::skip]
const SEED_36779_COURTYARD: [WallRow; 4] = [
    (-32.25071264479715, -24.535829340246856, 0.8333333333333334, 4.0),
    (-5.329323741965936, 34.35898346004749, 0.16666666666666666, 4.0),
    (-62.546576545208126, 60.513543453147484, 0.9166666666666666, 12.0),
    (-89.46796544803934, 1.618730652853138, 0.804052048031553, 1.0),
];

#[test]
fn a_hip_deeper_than_the_valley_top_it_butts_against_hangs_below_it_with_no_gap() {
    let frame = framed(&SEED_36779, &[&SEED_36779_COURTYARD]);
    // Read from the solve: the valley over the corner at (-58.022, 72.641)
    // rises at 0.129 in per inch of run to a node at (35.643, 108.248),
    // where a short hip carries its line on 8.7 degrees off it, rising at
    // 0.226, and butts against its top: both are cut plumb there, square
    // to the valley, in one plane. Both 9-1/4 in deep, the steeper hip is
    // the deeper plumb (9.25 sqrt(1 + 0.226^2) = 9.48 in against 9.33 in
    // for the valley), so its foot's lower corners are below the valley's
    // bottom edge. The line square to the face from such a corner runs on
    // under the valley's bottom, dropping 1 in 7.8 away from the top, and
    // meets it about an inch on: that was read as 1.02 in of gap. It is
    // the foot hanging below the valley's end. Derivation.
    let node = dvec2(35.642_927_707_706_82, 108.248_154_625_980_75);
    let u = (node - dvec2(-58.022_438_112_724_91, 72.641_261_535_209_96)).normalize();
    let valley = piece_ending_at(&frame, MemberKind::Valley, 1, node).expect("the valley up to the node");
    let hip = piece_ending_at(&frame, MemberKind::Hip, 0, node).expect("the hip starting at the node");
    let along = |v: glam::DVec3| (v.truncate() - node).dot(u);
    let on_plane = |f: &pitchframe_geometry::framing::Face| {
        f.normal.z.abs() < 1e-9
            && f.normal.truncate().dot(u).abs() > 1.0 - 1e-9
            && f.vertices.iter().all(|&v| along(v).abs() < 1e-6)
    };
    let valley_face: Vec<_> = frame.pieces[valley].solid.faces().filter(|f| on_plane(f)).collect();
    let hip_face: Vec<_> = frame.pieces[hip].solid.faces().filter(|f| on_plane(f)).collect();
    assert!(
        !valley_face.is_empty() && !hip_face.is_empty(),
        "both ends plumb at the node, square to the valley"
    );
    let low = |faces: &[&pitchframe_geometry::framing::Face]| {
        faces.iter().flat_map(|f| f.vertices.iter().map(|v| v.z)).fold(f64::INFINITY, f64::min)
    };
    let below = low(&valley_face) - low(&hip_face);
    assert!(below > 0.1 && below < 0.2, "the hip's foot reaches {below} in below the valley's");
    let joint = frame.joints.iter().find(|j| j.pieces == [hip, valley]).expect("the hip bears on the valley");
    assert!(joint.max_gap < FIT_IN && joint.max_overlap < FIT_IN, "{joint:?}");
    let (gap, overlap, mating) = parry_fit::fit(&frame, hip, valley);
    assert!(mating >= 1 && gap < FIT_IN && overlap < FIT_IN, "parry {gap} / {overlap}");
    for j in &frame.joints {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
    }
}

/// Seed 194: a plan round a courtyard at 3/12 beside 6/12 walls, where the
/// courtyard wall's plane runs on up past the end of a ridge (where that
/// plane meets the steeper plane of wall 12) to the main ridge. The valley
/// jack laid out 0.47 in from that ridge's end (at a hip end, where the
/// ridge board runs half a rafter past its node) would hold it in its board.
#[rustfmt::skip]
const SEED_194: [WallRow; 15] = [
    (340.39885780022325, 0.0, 0.5, 4.0),
    (529.5900391721674, 0.0, 0.5, 19.0),
    (745.5833920013444, 0.0, 0.5, 3.0),
    (745.5833920013444, 163.30642591936916, 0.5, 10.0),
    (745.5833920013444, 418.46256559806613, 0.5, 5.0),
    (647.0941305958881, 418.46256559806613, 0.5, 22.0),
    (647.0941305958881, 714.1737235866232, 0.5, 15.0),
    (611.1732559452643, 714.1737235866232, 0.5, 11.0),
    (569.5420552906595, 714.1737235866232, 0.5, 11.0),
    (529.5900391721674, 714.1737235866232, 0.5, 2.0),
    (529.5900391721674, 385.55594146877723, 0.5, 19.0),
    (529.5900391721674, 163.30642591936916, 0.5, 15.0),
    (340.39885780022325, 163.30642591936916, 0.5, 24.0),
    (340.39885780022325, 111.76676005636291, 0.5, 9.0),
    (340.39885780022325, 42.27130049014065, 0.5, 8.0),
];

#[rustfmt::skip]
const SEED_194_COURTYARD: [WallRow; 4] = [
    (629.9343218292735, 274.7307851248064, 0.25, 1.0),
    (669.6181370484295, 274.7307851248064, 0.25, 16.0),
    (669.6181370484295, 237.64860862845967, 0.25, 8.0),
    (629.9343218292735, 237.64860862845967, 0.25, 16.0),
];

/// Seed 30468: a valley jack laid out 0.6 in from the end of a lower ridge
/// running square to it across its plane.
#[rustfmt::skip]
const SEED_30468: [WallRow; 22] = [
    (0.0, 360.1087151459126, 0.0, 17.0),
    (101.06308147322082, 360.2789343369925, 0.0, 6.0),
    (147.98808328909425, 360.1087151459126, 1.0833333333333333, 16.0),
    (147.98808328909425, 80.52267750055327, 1.0833333333333333, 10.0),
    (147.98808328909425, 0.0, 1.1666666666666667, 21.0),
    (388.78097263140717, 0.0, 1.1666666666666667, 9.0),
    (648.1887524422924, 0.0, 1.1666666666666667, 1.0),
    (802.070130838942, 0.0, 1.0, 9.0),
    (802.070130838942, 80.52267750055327, 0.4166666666666667, 20.0),
    (930.953282423628, 80.52267750055327, 0.4166666666666667, 16.0),
    (1097.9116892647135, 80.52267750055327, 0.8333333333333334, 14.0),
    (1097.9116892647135, 227.25072115016624, 0.8333333333333334, 14.0),
    (1097.9116892647135, 360.1087151459126, 0.5, 19.0),
    (1097.7415108115915, 418.43588478347453, 1.0833333333333333, 8.0),
    (1097.9116892647135, 492.78441692227545, 0.5833333333333334, 15.0),
    (998.2471678846237, 492.78441692227545, 0.5833333333333334, 3.0),
    (897.6883277250652, 492.78441692227545, 0.5833333333333334, 16.0),
    (802.070130838942, 492.78441692227545, 1.3333333333333333, 22.0),
    (802.070130838942, 720.4997710428537, 0.8333333333333334, 8.0),
    (0.0, 720.4997710428537, 0.6901555296810714, 21.0),
    (0.0, 564.8011305482071, 0.6901555296810714, 5.0),
    (0.0, 493.43453268480937, 0.6901555296810714, 6.0),
];

#[rustfmt::skip]
const SEED_30468_COURTYARD: [WallRow; 4] = [
    (481.28755456348756, 350.98910069172564, 0.5, 20.0),
    (561.2829676209195, 350.98910069172564, 1.4810197213273302, 16.0),
    (561.2829676209195, 270.4109035042584, 0.6666666666666666, 10.0),
    (481.28755456348756, 270.4109035042584, 1.0833333333333333, 6.0),
];

/// Seed 35540: a valley jack laid out 0.53 in from the valley end of the
/// ridge it is framed to, so that a quarter of its board ran on past the
/// ridge board's end with nothing under its top cut.
#[rustfmt::skip]
const SEED_35540: [WallRow; 16] = [
    (0.0, 209.28242250814938, 1.38838023744913, 11.0),
    (204.4367135864182, 209.28242250814938, 1.38838023744913, 19.0),
    (377.5661243974922, 209.28242250814938, 0.25, 2.0),
    (377.5661243974922, 445.0534515564212, 0.16666666666666666, 22.0),
    (601.5056881727126, 445.0534515564212, 0.8333333333333334, 22.0),
    (601.5056881727126, 299.1224935579362, 0.8333333333333334, 5.0),
    (601.5056881727126, 209.28242250814938, 0.16666666666666666, 5.0),
    (812.5219551164068, 209.28242250814938, 0.4166666666666667, 22.0),
    (812.5219551164068, 445.0534515564212, 0.5833333333333334, 19.0),
    (1030.8999493966762, 445.0534515564212, 0.3333333333333333, 18.0),
    (1030.8999493966762, 209.28242250814938, 0.8333333333333334, 19.0),
    (1149.22542838162, 209.28242250814938, 0.4166666666666667, 9.0),
    (1149.22542838162, 128.13975576342708, 0.4166666666666667, 8.0),
    (1149.22542838162, 63.92427752222165, 0.4166666666666667, 22.0),
    (1149.22542838162, 0.0, 0.2517317527930338, 18.0),
    (0.0, 0.0, 0.5833333333333334, 12.0),
];

/// The jacks moved off the layout to clear a ridge's end: jack, ridge,
/// how far.
fn jacks_moved(frame: &Frame) -> Vec<(String, String, f64)> {
    frame
        .warnings
        .iter()
        .filter_map(|w| match w {
            FramingWarning::JackMovedOffLayout { label, ridge, by_in } => {
                Some((label.clone(), ridge.clone(), *by_in))
            }
            _ => None,
        })
        .collect()
}

/// Asserts that every joint fits, that one jack is moved off the layout,
/// by `by_in`, that it is the valley jack whose plan line runs `to` (a
/// plan coordinate read by `across`), that no valley jack is left at
/// `layout_at` passing within 2 in of the ridge's end `node` (jacks of other
/// planes on the same layout line stay), that its member carries the
/// warning, and that it shares no wood with any other piece.
fn assert_jack_moved_clear(
    frame: &Frame,
    across: impl Fn(DVec2) -> f64,
    node: DVec2,
    layout_at: f64,
    to: f64,
) {
    for j in &frame.joints {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
    }
    let moved = jacks_moved(frame);
    assert_eq!(moved.len(), 1, "{moved:?}");
    let (label, _, by) = &moved[0];
    assert!((by - (to - layout_at).abs()).abs() < 1e-9, "moved by {by}, not {}", (to - layout_at).abs());
    let on = |p: &pitchframe_geometry::framing::PlacedPiece, at: f64| {
        p.kind == MemberKind::ValleyJack && p.plan_line.iter().all(|&q| (across(q) - at).abs() < 1e-6)
    };
    let Some(jack) = frame.pieces.iter().find(|p| on(p, to)) else {
        panic!("no valley jack moved clear of the ridge's end");
    };
    assert_eq!(&jack.label, label);
    let near_node = |p: &pitchframe_geometry::framing::PlacedPiece| {
        let [a, b] = p.plan_line;
        let t = ((node - a).dot(b - a) / (b - a).length_squared()).clamp(0.0, 1.0);
        node.distance(a + (b - a) * t) < 2.0
    };
    assert!(
        !frame.pieces.iter().any(|p| on(p, layout_at) && near_node(p)),
        "a valley jack is left on the layout at the ridge's end"
    );
    let Some(member) = frame.members.iter().find(|m| &m.label == label) else {
        panic!("no member {label}");
    };
    assert!(member.warnings.iter().any(|w| matches!(w, FramingWarning::JackMovedOffLayout { .. })));
    // Where it stands now it shares no wood with any piece (parry's depth
    // between the solids, under 1/64 in).
    let Some(moved_piece) = frame.pieces.iter().position(|p| on(p, to)) else {
        panic!("no piece of the moved jack");
    };
    let (depth, a, b, unhulled) =
        parry_fit::interference_where_measurable(frame, |i, j| i != moved_piece && j != moved_piece);
    assert!(unhulled.is_empty(), "parts parry cannot hull: {unhulled:?}");
    assert!(depth < FIT_IN, "{a} and {b} share {depth} in");
}

#[test]
fn a_valley_jack_at_the_end_of_a_ridge_ending_at_a_hip_is_moved_clear_of_the_board() {
    let frame = framed(&SEED_194, &[&SEED_194_COURTYARD]);
    let [_, node] =
        solved_ridge(&SEED_194, &[&SEED_194_COURTYARD], dvec2(414.741, 88.964), dvec2(603.932, 88.964));
    // The ridge between walls 12 and 18 (the file's order, from 1) ends at
    // a hip end, where its board runs half a 1-1/2 in rafter (0.75 in) on
    // past the node; the jack laid out at x = 604.399 in (24 in centres
    // from the first corner: 340.399 + 11 x 24) goes to the node's x + 0.75
    // + 0.75 (its own half thickness) + 1/16 in (the clearance). Default 2x
    // thicknesses, common practice, no source; the rest derivation.
    let layout_x = 340.398_857_800_223_25 + 11.0 * 24.0;
    let to = node.x + 0.75 + 0.75 + 1.0 / 16.0;
    assert_jack_moved_clear(&frame, |p| p.x, node, layout_x, to);
}

#[test]
fn a_valley_jack_at_the_end_of_a_ridge_square_to_it_is_moved_clear_of_the_board() {
    let frame = framed(&SEED_30468, &[&SEED_30468_COURTYARD]);
    let [_, node] =
        solved_ridge(&SEED_30468, &[&SEED_30468_COURTYARD], dvec2(314.638, 154.746), dvec2(314.638, 359.504));
    // That ridge's board ends square at its node, 0.6 in short of the line
    // of the jack laid out on the wall at y = 360.109 in (the first corner's
    // y, where the layout starts, 0 x 24 in on). Clear of it by its half
    // thickness and 1/16 in, the jack would still hang 0.01 in past the end
    // of the ridge it is framed to, which starts at y = 359.579 and runs on
    // north: it goes to that end's y + 0.75 (its half thickness) + 1/16 in,
    // wholly on its ridge. Derivation.
    let [_, own] =
        solved_ridge(&SEED_30468, &[&SEED_30468_COURTYARD], dvec2(293.994, 359.579), dvec2(293.994, 477.018));
    let layout_y = SEED_30468[0].1;
    let to = own.y + 0.75 + 1.0 / 16.0;
    assert_jack_moved_clear(&frame, |p| p.y, node, layout_y, to);
}

#[test]
fn a_valley_jack_hanging_past_the_end_of_its_own_ridge_is_moved_onto_the_board() {
    let frame = framed(&SEED_35540, &[]);
    let ends = solved_ridge(&SEED_35540, &[], dvec2(909.579, 160.754), dvec2(909.579, 375.727));
    let node = if ends[0].y < ends[1].y { ends[0] } else { ends[1] };
    // The ridge between walls 8 and 10 (the file's order, from 1) ends
    // square at its node, where a valley comes up to it and, past a hip of
    // 0.05 in, the hip between walls 8 and 15. The jack laid out on the
    // wall at y = 161.282 in (the first corner's y less 2 x 24 in) runs
    // into that ridge with its centre line 0.53 in from the end, so 0.22 in
    // of its 1-1/2 in board was past the board's end, and the hip's board
    // comes up beside it. It goes to where the hip board's side face (half
    // a 1-1/2 in hip off its line) crosses the ridge board's side face (half
    // a 1-1/2 in ridge off its line), + 0.75 (its half thickness) + 1/16 in:
    // wholly on the ridge, clear of the hip. Default 2x thicknesses, common
    // practice, no source; the rest derivation.
    let [foot, top] =
        solved_line(&SEED_35540, &[], RoofLineKind::Hip, dvec2(862.888, 83.366), dvec2(909.628, 160.730));
    let (foot, top) = if foot.y < top.y { (foot, top) } else { (top, foot) };
    let d = (top - foot).normalize();
    let face = top + d.perp() * 0.75;
    let ridge_face_x = node.x - 0.75;
    let face_y = face.y + (ridge_face_x - face.x) * d.y / d.x;
    let layout_y = SEED_35540[0].1 - 2.0 * 24.0;
    let to = face_y + 0.75 + 1.0 / 16.0;
    assert!(to - node.y > 0.75 + 1.0 / 16.0, "the hip's board is the farther in");
    assert_jack_moved_clear(&frame, |p| p.y, node, layout_y, to);
}

/// Seed 14502: a plan round a courtyard whose north ridge steps 0.46 in
/// sideways and up where two ridges end 0.65 in apart, across a hip too
/// short to cut.
#[rustfmt::skip]
const SEED_14502: [WallRow; 8] = [
    (0.0, 532.3161905733148, 1.3333333333333333, 8.0),
    (291.8937739921361, 532.3161905733148, 1.3333333333333333, 11.0),
    (291.8937739921361, 424.25649671956614, 1.3333333333333333, 14.0),
    (518.8358461068178, 424.25649671956614, 1.3333333333333333, 12.0),
    (518.8358461068178, 175.8085883944868, 0.0, 12.0),
    (573.4377811234009, 175.8085883944868, 1.3333333333333333, 13.0),
    (573.4377811234009, 587.0189409139787, 1.3333333333333333, 18.0),
    (0.0, 587.0189409139787, 1.3333333333333333, 16.0),
];

#[rustfmt::skip]
const SEED_14502_COURTYARD: [WallRow; 4] = [
    (316.15339757228054, 453.6310600739241, 0.9166666666666666, 3.0),
    (409.02870589650723, 453.6310600739241, 0.9166666666666666, 14.0),
    (409.02870589650723, 518.7629307255063, 0.9166666666666666, 12.0),
    (316.15339757228054, 518.7629307255063, 0.9166666666666666, 21.0),
];

#[test]
fn a_king_flush_with_one_ridges_end_reads_no_gap_to_the_ridge_stepping_on() {
    let frame = framed(&SEED_14502, &[&SEED_14502_COURTYARD]);
    // Read from the solve: the east ridge (y = 559.211) has its hip end at
    // x = 319.702; the west ridge (y = 559.668, 0.457 in north and lower)
    // ends 0.457 in west of it, cut back to the east ridge's end, half a
    // rafter west of the node (x = 318.952). The courtyard plane's king at
    // the east ridge's end runs north along x = 319.702, its west side
    // flush with both ridges' ends. Its top is cut to the east ridge's
    // south side; below that ridge's bottom it hangs (the ridge is too
    // shallow for it), and there its face's west corner lies on the west
    // ridge's end plane, whose side is 0.457 in on: the face meets that
    // board only along the corner's edge, no gap (before, 0.457 in).
    let node = dvec2(319.70177814299524, 559.2109367631195);
    let foot = dvec2(node.x, SEED_14502_COURTYARD[2].1);
    let king = frame
        .pieces
        .iter()
        .position(|p| {
            p.kind == MemberKind::KingCommon
                && p.plan_line[0].distance(foot) < 0.01
                && p.plan_line[1].distance(node) < 0.01
        })
        .unwrap_or_else(|| panic!("the courtyard plane's king"));
    assert_joints_of_fit(&frame, king);
    // 1/64 in, the fit held (common practice, no source): the hang below
    // the ridge is still flagged.
    let label = &frame.pieces[king].label;
    let shallow = frame.warnings.iter().any(|w| {
        matches!(w, FramingWarning::RidgeTooShallow { rafter, short_by_in, .. } if rafter == label && *short_by_in > FIT_IN)
    });
    assert!(shallow, "{label}: the ridge too shallow for the king's top is flagged");
}

/// Seed 21566: a U whose main ridge steps 0.89 in sideways and 0.99 in up
/// halfway along, the two ridges meeting end to end with no hip between.
#[rustfmt::skip]
const SEED_21566: [WallRow; 8] = [
    (0.0, 0.0, 1.116914724061157, 6.0),
    (673.3558720712618, 0.0, 1.3333333333333333, 8.0),
    (673.3558720712618, 355.78468236573013, 0.5833333333333334, 5.0),
    (390.7324356958793, 355.78468236573013, 0.0, 24.0),
    (390.7324356958793, 237.1897882438201, 1.1666666666666667, 8.0),
    (271.5676575296013, 237.1897882438201, 1.25, 1.0),
    (271.5676575296013, 355.78468236573013, 0.659058670909107, 10.0),
    (0.0, 355.78468236573013, 0.891080743906476, 18.0),
];

#[test]
fn a_rafter_flush_with_a_ridges_end_reads_no_gap_to_the_ridge_stepping_on_from_it() {
    let frame = framed(&SEED_21566, &[]);
    // Read from the solve: the west ridge (y = 121.179) and the east one
    // (y = 122.065, higher) meet end to end at x = 390.732. The south
    // plane's rafter flush inside the step between them (x = 389.982, half
    // a rafter west) bears on the west ridge's south side; its top corner
    // at x = 390.732, above that ridge's top, lies on the east ridge's end
    // plane, whose side is 0.886 in on: the face meets that board only
    // along the corner's edge, no gap (before, 0.886 in).
    let top = dvec2(389.9824356958793, 121.17869796162309);
    let rafter = piece_ending_at(&frame, MemberKind::Common, 1, top).unwrap_or_else(|| panic!("the rafter"));
    assert_joints_of_fit(&frame, rafter);
}
/// Of a line's two ends, the one within 0.01 in of `p`.
fn end_at(ends: [DVec2; 2], p: DVec2) -> DVec2 {
    ends.into_iter().find(|e| e.distance(p) < 0.01).unwrap_or_else(|| panic!("no end at {p}"))
}
/// Plan distance from `p` to the line through `a` and `b`.
fn off_line(p: DVec2, [a, b]: [DVec2; 2]) -> f64 {
    (p - a).perp_dot((b - a).normalize()).abs()
}
/// The valley whose top is `top` bears on a ridge there and on the
/// passing member of `kind` its ridge's end is cut back to, and every
/// joint of it fits, by the frame's check and by parry.
fn assert_valley_top_cut_to_passing(frame: &Frame, top: DVec2, kind: MemberKind) {
    let valley = piece_ending_at(frame, MemberKind::Valley, 1, top)
        .unwrap_or_else(|| panic!("the valley up to {top}"));
    let bears_on = |k: MemberKind| {
        frame.joints.iter().any(|j| j.pieces[0] == valley && frame.pieces[j.pieces[1]].kind == k)
    };
    assert!(bears_on(MemberKind::Ridge), "the valley bears on the ridge");
    assert!(bears_on(kind), "the valley bears on the {kind:?} passing by");
    assert_joints_of_fit(frame, valley);
}
/// Seed 38662: a cross of wings round a courtyard, a hip passing a
/// hair off the node where two valleys meet a ridge's end.
#[rustfmt::skip]
const SEED_38662: [WallRow; 12] = [
    (0.0, 209.19982289627413, 1.3796046002971336, 14.0),
    (64.38538461202918, 209.19982289627413, 0.4166666666666667, 20.0),
    (64.38538461202918, 0.0, 0.5961194229959408, 14.0),
    (328.6914218260506, 0.0, 1.5, 7.0),
    (328.6914218260506, 209.19982289627413, 1.25, 0.0),
    (446.8578305230929, 209.19982289627413, 0.6666666666666666, 16.0),
    (446.8578305230929, 319.38316092313346, 0.5, 14.0),
    (328.6914218260506, 319.38316092313346, 0.8616900506968173, 17.0),
    (328.6914218260506, 511.56329881950364, 1.1666666666666667, 16.0),
    (64.38538461202918, 511.56329881950364, 0.4166666666666667, 3.0),
    (64.38538461202918, 319.38316092313346, 0.6666666666666666, 10.0),
    (0.0, 319.38316092313346, 0.4166666666666667, 13.0),
];

#[rustfmt::skip]
const SEED_38662_COURTYARD: [WallRow; 4] = [
    (96.81973404515605, 95.38541379955348, 0.25764885036980595, 10.0),
    (172.6119270547805, 95.38541379955348, 0.75, 9.0),
    (172.6119270547805, 185.53948820250952, 0.8333333333333334, 17.0),
    (96.81973404515605, 185.53948820250952, 1.4166666666666667, 17.0),
];

#[test]
fn a_valley_top_is_cut_back_to_a_hip_its_ridges_end_is_cut_back_to() {
    let frame = framed(&SEED_38662, &[&SEED_38662_COURTYARD]);
    // Read from the solve: the ridge from (118.858, 245.097) ends east at
    // (183.243, 245.097), where two valleys come up to it; the hip from
    // (89.448, 198.071) to (242.544, 274.619) passes 0.11 in off that
    // node, and the ridge's end is cut back to the hip's north side. The
    // valley from (64.385, 209.200), cut only to the ridge's south side,
    // ran on past where the ridge's end is cut away (0.22 in of gap, and
    // its corner into the hip): it is cut to the hip's side too.
    let courtyards: [&[WallRow]; 1] = [&SEED_38662_COURTYARD];
    let east = dvec2(183.243, 245.097);
    let node = end_at(solved_ridge(&SEED_38662, &courtyards, dvec2(118.858, 245.097), east), east);
    let hip = solved_line(
        &SEED_38662,
        &courtyards,
        RoofLineKind::Hip,
        dvec2(89.448, 198.071),
        dvec2(242.544, 274.619),
    );
    let off = off_line(node, hip);
    assert!(off > 0.01 && off < 0.75, "the hip passes {off} in off the node");
    assert_valley_top_cut_to_passing(&frame, node, MemberKind::Hip);
}

/// Seed 3808: a comb of wings off a long block, a hip passing 0.05 in off
/// the node where a valley meets a ridge's end.
#[rustfmt::skip]
const SEED_3808: [WallRow; 32] = [
    (0.0, 287.30617730089085, 0.8333333333333334, 10.0),
    (0.0, 449.28109924558095, 1.5, 7.0),
    (25.785806465698823, 449.281099245581, 1.5, 0.0),
    (51.772151187430445, 449.281099245581, 1.5, 1.0),
    (84.83242646913827, 449.28109924558095, 1.3333333333333333, 14.0),
    (84.83242646913827, 407.95160252179517, 1.3333333333333333, 22.0),
    (84.83242646913828, 329.90340131844647, 1.3333333333333333, 17.0),
    (84.83242646913827, 287.30617730089085, 1.5, 0.0),
    (118.7915330429849, 287.30617730089085, 1.5, 18.0),
    (146.52377039785253, 287.30617730089085, 1.5, 6.0),
    (169.66485293827654, 287.30617730089085, 0.3333333333333333, 1.0),
    (169.66485293827654, 449.28109924558095, 0.3333333333333333, 10.0),
    (204.41118948551684, 449.28109924558095, 0.3333333333333333, 22.0),
    (225.91847307079425, 449.281099245581, 0.3333333333333333, 16.0),
    (254.4972794074148, 449.28109924558095, 1.443773137662416, 11.0),
    (254.4972794074148, 409.25268718150306, 1.443773137662416, 13.0),
    (254.4972794074148, 356.1565992498612, 1.443773137662416, 12.0),
    (254.4972794074148, 287.30617730089085, 1.5, 8.0),
    (339.3297058765531, 287.30617730089085, 1.0, 3.0),
    (339.3297058765531, 449.28109924558095, 1.0, 8.0),
    (339.3297058765531, 523.1787220837751, 1.3333333333333333, 22.0),
    (424.16213234569136, 523.1787220837751, 1.4166666666666667, 1.0),
    (424.16213234569136, 287.30617730089085, 1.3333333333333333, 17.0),
    (508.99455881482965, 287.30617730089085, 0.8333333333333334, 23.0),
    (508.99455881482965, 0.0, 1.0833333333333333, 23.0),
    (424.16213234569136, 0.0, 1.0833333333333333, 7.0),
    (254.4972794074148, 0.0, 1.0833333333333333, 21.0),
    (169.66485293827654, 0.0, 1.0833333333333333, 18.0),
    (140.68778448865825, 0.0, 1.0833333333333333, 12.0),
    (118.85913570880369, 0.0, 1.0833333333333333, 20.0),
    (84.83242646913827, 0.0, 1.0833333333333333, 21.0),
    (0.0, 0.0, 0.8333333333333334, 5.0),
];

#[test]
fn a_valley_top_cut_back_to_a_backed_hip_reads_the_hip_as_one_board() {
    let frame = framed(&SEED_3808, &[]);
    // Read from the solve: the ridge from (302.973, 172.850) ends south at
    // (302.973, 158.543), where the valley from (424.162, 287.306) comes
    // up to it; the hip from (508.995, 0) to (292.125, 166.823) passes
    // 0.05 in off that node, and the ridge's end and the valley's top are
    // cut back to its north-east side. The hip is backed, its two halves
    // two parts meeting on its centre line: the valley's top corner
    // standing above the near half's backing runs into that half through
    // its top, not across a gap, and on into the far half there, which is
    // no way into the hip's wood (it read 0.75 in, the half's thickness).
    let south = dvec2(302.973, 158.543);
    let node = end_at(solved_ridge(&SEED_3808, &[], dvec2(302.973, 172.850), south), south);
    let hip = solved_line(&SEED_3808, &[], RoofLineKind::Hip, dvec2(508.995, 0.0), dvec2(292.125, 166.823));
    let off = off_line(node, hip);
    assert!(off > 0.01 && off < 0.75, "the hip passes {off} in off the node");
    let valley = piece_ending_at(&frame, MemberKind::Valley, 1, node)
        .unwrap_or_else(|| panic!("the valley up to {node}"));
    let on_hip: Vec<_> = frame
        .joints
        .iter()
        .filter(|j| j.pieces[0] == valley && frame.pieces[j.pieces[1]].kind == MemberKind::Hip)
        .collect();
    assert_eq!(on_hip.len(), 1, "the valley bears on the hip passing by");
    for j in frame.joints.iter().filter(|j| j.pieces[0] == valley) {
        assert!(j.max_gap < FIT_IN && j.max_overlap < FIT_IN, "{j:?}");
        // Parry's contact depth: the two do not run into each other. (Its
        // rays from just inside the cheek's corners are not read here: the
        // one by the top corner starts above the hip's backing and meets
        // the hip through its top, 0.026 in on.)
        let (_, overlap, _) = parry_fit::fit(&frame, j.pieces[0], j.pieces[1]);
        assert!(overlap < FIT_IN, "{:?}: parry overlap {overlap}", j.members);
    }
}
#[test]
fn ridges_meeting_across_two_left_out_hips_are_cut_to_each_other() {
    let frame = framed(&SEED_3072, &[]);
    // Read from the solve: the long ridge along y = 110.711 ends east at
    // (908.647, 110.711), the wing's ridge along x = 908.250 ends south
    // at (908.250, 111.345); two hips too short to cut join those ends
    // through (908.765, 110.829). The wing ridge's end is cut back to the
    // long ridge's north side and bears on it, and the valley coming up
    // to the long ridge's end from the north-west into the L is cut to
    // the wing ridge's west side too, bearing on both: before, its top ran
    // 0.04 in into the wing ridge's end, two short lines away.
    let (long, wing) = (dvec2(908.647, 110.711), dvec2(908.250, 111.345));
    let long_end = end_at(solved_ridge(&SEED_3072, &[], long, dvec2(110.766, 110.711)), long);
    let wing_end = end_at(solved_ridge(&SEED_3072, &[], dvec2(908.250, 775.370), wing), wing);
    let wing = frame
        .pieces
        .iter()
        .position(|p| p.kind == MemberKind::Ridge && p.plan_line.iter().any(|q| q.distance(wing_end) < 0.01))
        .unwrap_or_else(|| panic!("the wing ridge"));
    let long = frame
        .pieces
        .iter()
        .position(|p| p.kind == MemberKind::Ridge && p.plan_line.iter().any(|q| q.distance(long_end) < 0.01))
        .unwrap_or_else(|| panic!("the long ridge"));
    assert!(frame.joints.iter().any(|j| j.pieces == [wing, long]), "the wing ridge bears on the long one");
    assert_joints_of_fit(&frame, wing);
    let valley =
        piece_ending_at(&frame, MemberKind::Valley, 1, long_end).unwrap_or_else(|| panic!("the valley"));
    for ridge in [long, wing] {
        assert!(frame.joints.iter().any(|j| j.pieces == [valley, ridge]), "the valley bears on both ridges");
    }
    assert_joints_of_fit(&frame, valley);
}

/// Seed 24280: a block with a wing north, whose ridges meet at a T, their
/// ends joined by a hip too short to cut (0.30 in).
#[rustfmt::skip]
const SEED_24280: [WallRow; 18] = [
    (0.0, 0.0, 0.16666666666666666, 15.0),
    (763.3647210070538, 0.0, 1.034423206155582, 3.0),
    (763.3647210070538, 101.01267827841686, 1.0, 10.0),
    (572.5235407552904, 101.01267827841686, 1.0, 18.0),
    (381.6823605035269, 101.01267827841686, 0.6666666666666666, 12.0),
    (381.6823605035269, 305.65641946206966, 0.6666666666666666, 1.0),
    (381.6823605035269, 542.270970499899, 1.25, 19.0),
    (556.4818721557374, 542.270970499899, 1.25, 10.0),
    (763.3647210070538, 542.270970499899, 0.16666666666666666, 4.0),
    (763.3647210070538, 668.9813898349481, 0.28517554938314377, 6.0),
    (763.3536058665865, 668.9925049754155, 1.0926441188653295, 16.0),
    (572.5235407552904, 668.9925049754155, 1.0926441188653295, 5.0),
    (190.84118025176346, 668.9925049754155, 0.9166666666666666, 12.0),
    (190.84118025176346, 542.270970499899, 0.5833333333333334, 17.0),
    (127.25312232206295, 542.270970499899, 0.5833333333333334, 21.0),
    (127.23893910745088, 542.270970499899, 0.5833333333333334, 8.0),
    (60.120151699181754, 542.270970499899, 0.5833333333333334, 14.0),
    (0.0, 542.270970499899, 1.5, 7.0),
];

#[test]
fn a_ridge_end_is_cut_back_to_a_king_past_a_jack_of_no_length() {
    let frame = framed(&SEED_24280, &[]);
    // Read from the solve: the ridge along x = 271.195 ends north at
    // (271.195, 601.197), 0.18 in short of the line of the ridge along
    // y = 601.376, whose hip end is at (271.439, 601.376), a hip too short
    // to cut between the two ends. The end king of that hip end runs east
    // along y = 601.376 to the other ridge's end, half a rafter past the
    // node; the first ridge's end ran 0.24 in into it (and 0.57 in into
    // the other ridge's side). It was left so for a valley jack on the
    // layout at y = 600, 2.2 in long between centre lines but -0.1 in
    // between the valley's side and the ridge's, a wedge of wood. The end
    // is cut back to the king's side and the other ridge's, 0.75 in off
    // their line (half a 1-1/2 in board, default 2x, common practice, no
    // source), and bears on both.
    let east = dvec2(271.439, 601.376);
    let king_end = end_at(solved_ridge(&SEED_24280, &[], dvec2(320.079, 601.376), east), east);
    let north = dvec2(271.195, 601.197);
    let end = end_at(solved_ridge(&SEED_24280, &[], dvec2(271.195, 441.948), north), north);
    let ridge = frame
        .pieces
        .iter()
        .position(|p| p.kind == MemberKind::Ridge && p.plan_line.iter().any(|q| q.distance(end) < 0.01))
        .unwrap_or_else(|| panic!("the ridge ending at {end}"));
    let king = frame
        .pieces
        .iter()
        .position(|p| {
            p.kind == MemberKind::KingCommon
                && p.plan_line[1].distance(king_end) < 0.01
                && (p.plan_line[0].y - king_end.y).abs() < 1e-6
        })
        .unwrap_or_else(|| panic!("the end king"));
    assert!(frame.joints.iter().any(|j| j.pieces == [ridge, king]), "the ridge's end bears on the king");
    let top_y = frame.pieces[ridge].solid.vertices().map(|v| v.y).fold(f64::NEG_INFINITY, f64::max);
    assert!((top_y - (king_end.y - 0.75)).abs() < 1e-6, "the end cut back to y = {}", king_end.y - 0.75);
    assert_joints_of_fit(&frame, ridge);
    assert_joints_of_fit(&frame, king);
}

/// Asserts that the hip with end `end` (0 its foot, 1 its top) at `node`,
/// one end of a hip too short to cut (left out) whose other end `far`
/// meets a ridge, is cut to that ridge and bears on it: it has a joint on
/// the ridge through `far`, every joint of the hip fits within 1/64 in by
/// the frame's own check and by parry, and it shares no wood with any
/// ridge or king common (parry).
fn assert_hip_cut_to_ridge_across_left_out_hip(frame: &Frame, end: usize, node: DVec2, far: DVec2) {
    let hip = piece_ending_at(frame, MemberKind::Hip, end, node)
        .unwrap_or_else(|| panic!("no hip's end {end} at {node}"));
    let across = frame
        .pieces
        .iter()
        .enumerate()
        .position(|(_, p)| {
            let [a, b] = p.plan_line;
            let t = ((far - a).dot(b - a) / (b - a).length_squared()).clamp(0.0, 1.0);
            p.kind == MemberKind::Ridge && (a + (b - a) * t).distance(far) < 0.01
        })
        .unwrap_or_else(|| panic!("no ridge through the left-out hip's other end {far}"));
    let label = &frame.pieces[hip].label;
    assert!(
        frame.joints.iter().any(|j| j.pieces == [hip, across]),
        "{label} has no joint on {}",
        frame.pieces[across].label
    );
    assert_joints_of_fit(frame, hip);
    let other = |i: usize| matches!(frame.pieces[i].kind, MemberKind::Ridge | MemberKind::KingCommon);
    let (depth, x, y, unhulled) = parry_fit::interference_where_measurable(frame, |i, j| {
        !((i == hip && other(j)) || (j == hip && other(i)))
    });
    // Pieces elsewhere parry cannot hull (wedges thinner than its
    // round-off) are left; the hip, ridges and kings it can.
    let checked =
        |l: &String| frame.pieces.iter().enumerate().any(|(i, p)| &p.label == l && (i == hip || other(i)));
    assert!(!unhulled.iter().any(checked), "parts parry cannot hull: {unhulled:?}");
    assert!(depth < FIT_IN, "{x} and {y} share {depth} in");
}

/// Seed 10480: an orthogonal outline of 10 walls, mixed pitches.
#[rustfmt::skip]
const SEED_10480: [WallRow; 10] = [
    (0.0, 148.1515462935151, 0.3333333333333333, 14.0),
    (115.5493406898906, 148.1515462935151, 1.4166666666666667, 6.0),
    (115.5493406898906, 74.07577314675756, 1.1506116507376445, 2.0),
    (370.8132427645167, 74.07577314675756, 0.3333333333333333, 23.0),
    (370.8132427645167, 222.22731944027265, 1.0833333333333333, 8.0),
    (115.5493406898906, 222.22731944027265, 0.31362619170807376, 9.0),
    (115.5493406898906, 370.3788657337878, 0.4166666666666667, 21.0),
    (53.927897527682305, 370.3788657337878, 0.4166666666666667, 10.0),
    (53.927897527682305, 222.22731944027265, 1.0, 17.0),
    (0.0, 222.22731944027265, 0.6012264798001145, 15.0),
];

#[test]
fn a_hip_top_at_a_ridge_end_is_cut_to_the_ridge_across_a_left_out_hip() {
    let frame = framed(&SEED_10480, &[]);
    // The hip rising from (80.391, 212.049) ends at the west end of the
    // ridge along y = 204.798 at x = 99.245, a hip end run on half a
    // rafter to x = 98.495, and its top is cut to that end. A hip of
    // 1.40 in (left out) runs from there to the east end of the ridge along
    // y = 203.708 at x = 98.373, whose north side, y = 204.458, the hip's
    // lower side crossed: it ran 0.12 in into that ridge. Now its top is
    // cut to that side too and bears on it. Derivation (nodes from the
    // solved roof's lines).
    assert_hip_cut_to_ridge_across_left_out_hip(
        &frame,
        1,
        dvec2(99.24484109981634, 204.79772575868265),
        dvec2(98.37336141573684, 203.70837615358326),
    );
}

/// Seed 21210: an orthogonal outline of 23 walls at 2/12 round a
/// courtyard at 14/12.
#[rustfmt::skip]
const SEED_21210: [WallRow; 23] = [
    (0.0, 155.29439421692695, 0.16666666666666666, 24.0),
    (299.5988240615123, 155.29439421692695, 0.16666666666666666, 15.0),
    (299.5988240615123, 71.93451290741244, 0.16666666666666666, 20.0),
    (299.5988240615123, 0.013757693707523453, 0.16666666666666666, 3.0),
    (299.6125817552198, 0.0, 0.16666666666666666, 11.0),
    (396.8612834871269, 0.0, 0.16666666666666666, 3.0),
    (396.8612834871269, 88.03284043040013, 0.16666666666666666, 20.0),
    (396.8612834871269, 88.04981593238374, 0.16666666666666666, 24.0),
    (396.8612834871269, 155.29439421692695, 0.16666666666666666, 9.0),
    (613.4357875612668, 155.29439421692695, 0.16666666666666666, 20.0),
    (613.4357875612668, 238.82775876279513, 0.16666666666666666, 20.0),
    (613.4357875612668, 238.84187238404277, 0.16666666666666666, 11.0),
    (613.4357875612668, 311.07337166949117, 0.16666666666666666, 23.0),
    (396.87520801548277, 311.07337166949117, 0.16666666666666666, 13.0),
    (396.8612834871269, 311.087296197847, 0.16666666666666666, 6.0),
    (396.8612834871269, 465.1806050852674, 0.16666666666666666, 5.0),
    (613.4357875612668, 465.1806050852674, 0.16666666666666666, 9.0),
    (613.4357875612668, 691.145619069709, 0.16666666666666666, 8.0),
    (613.424959057943, 691.1564475730328, 0.16666666666666666, 11.0),
    (299.5988240615123, 691.1564475730328, 0.16666666666666666, 15.0),
    (0.0, 691.1564475730328, 0.16666666666666666, 19.0),
    (0.0, 465.1806050852674, 0.16666666666666666, 24.0),
    (0.0, 311.07337166949117, 0.16666666666666666, 20.0),
];

#[rustfmt::skip]
const SEED_21210_COURTYARD: [WallRow; 4] = [
    (216.47595850554575, 320.89996075203936, 1.1666666666666667, 6.0),
    (271.14943650799364, 320.89996075203936, 1.1666666666666667, 22.0),
    (271.14943650799364, 253.74811295838964, 1.1666666666666667, 7.0),
    (216.47595850554575, 253.74811295838964, 1.1666666666666667, 10.0),
];

#[test]
fn hips_meeting_with_no_ridge_are_cut_to_the_ridge_across_a_left_out_hip() {
    let frame = framed(&SEED_21210, &[&SEED_21210_COURTYARD]);
    // Two hips meet at (286.876, 265.383) with no ridge there: the one
    // rising from the east end of the ridge along y = 241.441 at
    // x = 283.456 took only the hub cut against the other. A hip of 0.14 in
    // (left out) runs from there to the south end of the ridge along
    // x = 286.863 at y = 265.525, which the hip's top ran 0.16 in into.
    // Now its top is cut to that end and bears on it. Derivation (nodes
    // from the solved roof's lines).
    assert_hip_cut_to_ridge_across_left_out_hip(
        &frame,
        1,
        dvec2(286.8764025456924, 265.38315648081857),
        dvec2(286.8634173803853, 265.52468822433485),
    );
}

/// Seed 31550: an orthogonal outline of 44 walls, mixed pitches.
#[rustfmt::skip]
const SEED_31550: [WallRow; 44] = [
    (266.46009056339693, 185.1006653102607, 0.8333333333333334, 16.0),
    (266.2656535220934, 449.91689647423766, 0.9166666666666666, 22.0),
    (314.4193339186762, 449.91689647423766, 0.5833333333333334, 16.0),
    (314.40100895625875, 507.2083216531492, 0.16666666666666666, 24.0),
    (314.4193339186762, 542.5728127379848, 1.2854486076474292, 23.0),
    (314.4193339186762, 603.8943493716685, 0.6666666666666666, 16.0),
    (314.39830147274705, 640.9080189610371, 0.3333333333333333, 2.0),
    (314.4193339186762, 688.4324031761527, 0.883046526753248, 9.0),
    (266.2656535220934, 688.4324031761527, 1.0771921911083326, 5.0),
    (266.2656535220934, 727.0893011649671, 1.0771921911083326, 6.0),
    (266.2656535220934, 784.109086457561, 1.0771921911083326, 17.0),
    (266.2656535220934, 816.7508668259737, 0.6666666666666666, 3.0),
    (314.4193339186762, 816.7508668259737, 1.0833333333333333, 23.0),
    (387.5769373436005, 816.8659526133648, 1.0833333333333333, 15.0),
    (458.04429327633295, 816.7508668259737, 1.25, 1.0),
    (458.04429327633295, 1017.9720916202763, 1.5, 20.0),
    (481.12915888737814, 1017.9720916202763, 0.3333333333333333, 1.0),
    (491.92334973144153, 1017.9322149023433, 1.3333333333333333, 11.0),
    (514.151086252408, 1017.9720916202763, 1.3333333333333333, 16.0),
    (636.009122470678, 1017.9720916202763, 1.3333333333333333, 22.0),
    (636.009122470678, 816.7508668259737, 1.3333333333333333, 18.0),
    (636.009122470678, 772.6045754332513, 1.3333333333333333, 1.0),
    (636.009122470678, 731.075306275972, 0.16666666666666666, 14.0),
    (576.9743155152937, 731.075306275972, 1.3333333333333333, 21.0),
    (577.0081424647801, 716.2766574613254, 0.16666666666666666, 16.0),
    (576.9743155152937, 709.1617384196365, 0.6788543447173296, 20.0),
    (576.9743155152937, 688.4324031761527, 0.5833333333333334, 0.0),
    (546.8088535434581, 688.4324031761527, 0.5833333333333334, 7.0),
    (514.151086252408, 688.4324031761527, 0.5, 5.0),
    (514.1120752853021, 641.2575146247186, 0.7472939863789767, 8.0),
    (514.151086252408, 592.6456880575847, 1.409284622218485, 2.0),
    (514.0567437245352, 570.9804242372286, 0.6666666666666666, 1.0),
    (514.151086252408, 544.7594455135963, 0.4166666666666667, 20.0),
    (514.0685993729059, 491.2459070454475, 0.9166666666666666, 9.0),
    (514.151086252408, 449.91689647423766, 0.4166666666666667, 11.0),
    (478.24321083568606, 449.81702841699735, 1.0, 19.0),
    (458.04429327633295, 449.91689647423766, 0.25, 10.0),
    (458.04429327633295, 212.37033769827735, 0.25, 12.0),
    (458.04429327633295, 121.33216995915149, 0.25, 14.0),
    (458.04429327633295, 58.00940353290855, 0.25, 19.0),
    (458.04429327633295, 0.0, 1.4166666666666667, 5.0),
    (385.9179096514024, 0.0, 1.4166666666666667, 20.0),
    (314.4193339186762, 0.0, 1.4166666666666667, 1.0),
    (266.2656535220934, 0.0, 0.6822151432320395, 11.0),
];

#[test]
fn a_hip_foot_where_hips_meet_is_cut_to_the_ridge_across_a_left_out_hip() {
    let frame = framed(&SEED_31550, &[]);
    // The hip running up to the north end of the ridge along x = 499.901
    // starts up on the roof at (514.180, 986.001), where the hip rising
    // from the wall at x = 514.151 ends, with no ridge there: its foot took
    // only the hub cut against that hip. A hip of 0.21 in (left out) runs
    // from there to the west end of the ridge along y = 986.095 at
    // x = 514.364, which the foot ran 0.08 in into. Now the foot is cut
    // to that end and bears on it. Derivation (nodes from the solved
    // roof's lines).
    assert_hip_cut_to_ridge_across_left_out_hip(
        &frame,
        0,
        dvec2(514.1797645683795, 986.0008263191114),
        dvec2(514.3640843380689, 986.0946710264647),
    );
}

/// Seed 37286: an orthogonal outline of 18 walls, mixed pitches.
#[rustfmt::skip]
const SEED_37286: [WallRow; 18] = [
    (342.26157387308274, 261.8433083436239, 0.6361454429713249, 13.0),
    (342.27461585941074, 261.8563503299519, 1.0833333333333333, 4.0),
    (513.392360809624, 261.8563503299519, 1.4425262043838147, 24.0),
    (513.392360809624, 443.6893913625703, 1.4856758824694956, 12.0),
    (342.26157387308274, 443.6893913625703, 1.5, 7.0),
    (342.26157387308274, 546.2976040830231, 0.25, 21.0),
    (342.27538493479045, 546.3114151447309, 0.9166666666666666, 20.0),
    (432.5281379809656, 546.3114151447309, 0.9166666666666666, 20.0),
    (513.392360809624, 546.3114151447309, 0.9166666666666666, 4.0),
    (855.6539346827069, 546.3114151447309, 1.0, 7.0),
    (855.6539346827069, 443.6893913625703, 0.4166666666666667, 2.0),
    (1026.7847216192483, 443.6893913625703, 0.4166666666666667, 15.0),
    (1026.7847216192483, 264.70327470665416, 0.4166666666666667, 21.0),
    (1026.7847216192483, 0.0, 1.0, 12.0),
    (855.6539346827069, 0.0, 1.0, 20.0),
    (617.2099752916492, 0.0, 1.0, 5.0),
    (617.19546993622, 0.0, 1.0, 7.0),
    (342.26157387308274, 0.0, 1.1666666666666667, 18.0),
];

#[test]
fn a_hip_top_at_a_valley_top_is_cut_to_the_ridge_across_a_left_out_hip() {
    let frame = framed(&SEED_37286, &[]);
    // The hip rising from the north end of the ridge along x = 733.418
    // ends at (700.798, 136.477), a valley's top with no ridge there, and
    // was cut plumb at that node. A hip of 0.87 in (left out) runs from
    // there to the east end of the ridge along y = 136.165 at x = 699.988,
    // a hip end run on half a rafter to x = 700.738, whose north side,
    // y = 136.915, the hip's top ran 0.38 in into, and 0.40 in into the
    // king common on that end. Now its top is cut to that side and bears
    // on it. Derivation (nodes from the solved roof's lines).
    assert_hip_cut_to_ridge_across_left_out_hip(
        &frame,
        1,
        dvec2(700.7982971500076, 136.4769563033209),
        dvec2(699.9879964074682, 136.165302171575),
    );
}

/// Seed 37572: an orthogonal outline of 48 walls, mixed pitches.
#[rustfmt::skip]
const SEED_37572: [WallRow; 48] = [
    (0.0, 87.16995190809224, 0.5400469396966471, 13.0),
    (0.0148941054545411, 87.1550578026377, 0.8916988178005, 20.0),
    (144.02231203284012, 87.1550578026377, 0.7167918668978525, 20.0),
    (144.0327394573245, 87.14463037815331, 0.4403543938332251, 4.0),
    (144.0327394573245, 0.0, 0.9166666666666666, 6.0),
    (288.0558899963421, 0.0, 0.9166666666666666, 10.0),
    (288.07506783295594, 0.0, 0.9166666666666666, 19.0),
    (432.08667524068574, 0.0, 0.9166666666666666, 22.0),
    (432.1097615032613, 0.0, 0.9166666666666666, 14.0),
    (576.130957829298, 0.0, 1.25, 9.0),
    (576.130957829298, 87.1550578026377, 0.8333333333333334, 15.0),
    (720.1636972866226, 87.1550578026377, 0.3333333333333333, 15.0),
    (720.1636972866226, 0.01774003019600823, 0.4166666666666667, 19.0),
    (720.1814373168186, 0.0, 1.1666666666666667, 14.0),
    (864.1964367439471, 0.0, 0.75, 8.0),
    (864.1964367439471, 261.4651734079131, 0.75, 4.0),
    (864.1964367439471, 348.6202312105508, 1.3333333333333333, 17.0),
    (707.9707591912938, 348.6202312105508, 1.3333333333333333, 4.0),
    (576.130957829298, 348.6202312105508, 1.335448820080879, 23.0),
    (576.130957829298, 261.4651734079131, 0.8282543786089355, 6.0),
    (432.09821837197353, 261.4651734079131, 1.4687673428970587, 11.0),
    (432.09821837197353, 308.7653410688065, 1.4687673428970587, 16.0),
    (432.09821837197353, 348.6202312105508, 0.16666666666666666, 4.0),
    (288.065478914649, 348.6202312105508, 0.7092489519012118, 8.0),
    (288.065478914649, 381.43093811398455, 0.7092489519012118, 2.0),
    (288.065478914649, 401.2869622949797, 0.7092489519012118, 12.0),
    (288.065478914649, 401.3093912389026, 0.7092489519012118, 1.0),
    (288.065478914649, 435.7752890131885, 0.75, 5.0),
    (432.0915788767416, 435.7752890131885, 0.75, 9.0),
    (432.10485786720545, 435.7752890131885, 0.75, 7.0),
    (576.130957829298, 435.7752890131885, 0.3333333333333333, 1.0),
    (576.130957829298, 461.602687115228, 0.3333333333333333, 12.0),
    (576.130957829298, 490.88786566293857, 0.3333333333333333, 2.0),
    (576.130957829298, 522.9303468158262, 0.1886426377634914, 14.0),
    (432.09821837197353, 522.9303468158262, 0.1886426377634914, 12.0),
    (0.0, 522.9303468158262, 0.3333333333333333, 16.0),
    (0.0, 435.7752890131885, 1.5, 5.0),
    (61.6506122441629, 435.7752890131885, 1.5, 16.0),
    (85.99008319648419, 435.7752890131885, 1.5, 19.0),
    (144.01863428315468, 435.7752890131885, 1.0833333333333333, 2.0),
    (144.0327394573245, 435.7611838390187, 0.75, 3.0),
    (144.0327394573245, 348.6202312105508, 0.3333333333333333, 5.0),
    (97.40967850029259, 348.6202312105508, 0.3333333333333333, 23.0),
    (97.39343863820679, 348.6202312105508, 0.3333333333333333, 15.0),
    (42.38819186613977, 348.6202312105508, 0.3333333333333333, 16.0),
    (0.014912713726659872, 348.6202312105508, 0.3333333333333333, 2.0),
    (0.0, 348.6053184968241, 1.4166666666666667, 13.0),
    (0.0, 261.4651734079131, 1.4166666666666667, 6.0),
];

#[test]
fn a_hip_top_where_hips_meet_is_cut_to_the_end_of_the_ridge_across_a_left_out_hip() {
    let frame = framed(&SEED_37572, &[]);
    // The hip rising from the south end of the ridge along x = 214.038
    // ends at (198.492, 158.030), where another hip ends, with no ridge
    // there: its top took the hub cut against that hip. A hip of 0.52 in
    // (left out) runs from there to the east end of the ridge along
    // y = 158.300 at x = 198.043, which the hip's top ran 0.37 in into.
    // Now its top is cut to that end and bears on it. Derivation (nodes
    // from the solved roof's lines).
    assert_hip_cut_to_ridge_across_left_out_hip(
        &frame,
        1,
        dvec2(198.4915192089223, 158.0295200937666),
        dvec2(198.04286321669548, 158.3001765017437),
    );
}

/// Asserts that the hip whose top is at `top`, the end of a ridge whose
/// side it is cut to, has its top stepped where that ridge ends and the
/// next ridge begins: a hip too short to cut (left out) runs from `top` to
/// `far`, the end of the next ridge, in line with the first and less than
/// a ridge's thickness aside, butted against its end. The hip bears on
/// both ridges' sides (a joint on each), its top cut is a stepped cheek
/// whose step is the two ridges' offset square to their line (read from
/// the nodes), every joint of the hip fits within 1/64 in by the frame's
/// own check and by parry, and it shares no wood with any ridge (parry).
fn assert_hip_top_stepped_at_ridge_end(frame: &Frame, top: DVec2, far: DVec2) {
    let hip =
        piece_ending_at(frame, MemberKind::Hip, 1, top).unwrap_or_else(|| panic!("no hip's top at {top}"));
    let through = |p: DVec2, [a, b]: [DVec2; 2]| {
        let t = ((p - a).dot(b - a) / (b - a).length_squared()).clamp(0.0, 1.0);
        (a + (b - a) * t).distance(p) < 0.01
    };
    let ridge = |at: DVec2, not: Option<usize>| {
        frame
            .pieces
            .iter()
            .enumerate()
            .position(|(i, p)| p.kind == MemberKind::Ridge && Some(i) != not && through(at, p.plan_line))
            .unwrap_or_else(|| panic!("no ridge through {at}"))
    };
    let own = ridge(top, None);
    let next = ridge(far, Some(own));
    let label = &frame.pieces[hip].label;
    for r in [own, next] {
        assert!(
            frame.joints.iter().any(|j| j.pieces == [hip, r]),
            "{label} has no joint on {}",
            frame.pieces[r].label
        );
    }
    let [a, b] = frame.pieces[own].plan_line;
    let offset = (top - far).perp_dot((b - a).normalize()).abs();
    let member =
        frame.members.iter().find(|m| &m.label == label).unwrap_or_else(|| panic!("no member {label}"));
    let step = member.cuts.iter().find_map(|c| match c {
        Cut::SteppedCheek { end: CutEnd::Top, step_in, step_from_side_in, .. } => {
            Some((*step_in, *step_from_side_in))
        }
        _ => None,
    });
    let Some((step_in, from_side)) = step else {
        panic!("{label}'s top is not a stepped cheek: {:?}", member.cuts);
    };
    assert!((step_in.abs() - offset).abs() < 1e-6, "step {step_in} in, the ridges {offset} in apart");
    // The step lies across the top edge, between the board's sides: the
    // cheek's line there is the board's thickness over the sine of the
    // angle between the hip and the ridge in plan (1-1/2 in, default 2x
    // thickness; common practice, no source).
    let [h0, h1] = frame.pieces[hip].plan_line;
    let sin = (h1 - h0).normalize().perp_dot((b - a).normalize()).abs();
    let line_in = 1.5 / sin;
    assert!(
        from_side > 0.0 && from_side < line_in,
        "the step {from_side} in along a cheek line {line_in} in"
    );
    assert_joints_of_fit(frame, hip);
    let is_ridge = |i: usize| frame.pieces[i].kind == MemberKind::Ridge;
    let (depth, x, y, unhulled) = parry_fit::interference_where_measurable(frame, |i, j| {
        !((i == hip && is_ridge(j)) || (j == hip && is_ridge(i)))
    });
    let checked =
        |l: &String| frame.pieces.iter().enumerate().any(|(i, p)| &p.label == l && (i == hip || is_ridge(i)));
    assert!(!unhulled.iter().any(checked), "parts parry cannot hull: {unhulled:?}");
    assert!(depth < FIT_IN, "{x} and {y} share {depth} in");
}

#[test]
fn a_hip_top_at_a_ridge_step_a_hair_aside_is_stepped_with_it() {
    let frame = framed(&SEED_9260, &[]);
    // The ridge along y = 251.865 ends east at x = 293.362, a hip end, and
    // runs on half a rafter to x = 294.112. A hip of 0.096 in (left out)
    // runs from there to the west end of the short ridge along
    // y = 251.797 at x = 293.430, cut back to the first one's end. The hip
    // rising from (313.260, 275.675) is cut to the first ridge's north
    // side, y = 252.615, and its cheek there ran on to x = 294.966, where
    // the short ridge's north side, y = 252.547, stood 0.0675 in back (a
    // gap of 0.0675 in). Now the cheek is cut 0.0675 in deeper past
    // x = 294.112 and bears on both. Derivation (nodes from the solved
    // roof's lines).
    assert_hip_top_stepped_at_ridge_end(
        &frame,
        dvec2(293.3617506133659, 251.86477280258222),
        dvec2(293.4301075797923, 251.7972417687007),
    );
}

#[test]
fn a_hip_top_at_a_ridge_step_from_the_south_is_stepped_with_it() {
    let frame = framed(&SEED_16522, &[]);
    // The ridge along y = 565.197 ends west at x = 495.075, a hip end, and
    // runs on half a rafter to x = 494.325. A hip of 0.58 in (left out)
    // runs from there to the east end of the ridge along y = 565.622 at
    // x = 494.674. The hip rising from (459.340, 243.576) is cut to the
    // first ridge's south side, y = 564.447, and its cheek there ran on to
    // x = 494.237, where the other ridge's south side, y = 564.872, stood
    // 0.425 in back (a gap of 0.4252 in). Now the cheek is cut 0.425 in
    // deeper past x = 494.325 and bears on both. Derivation (nodes from
    // the solved roof's lines).
    assert_hip_top_stepped_at_ridge_end(
        &frame,
        dvec2(495.0753660830004, 565.1968107468999),
        dvec2(494.6737811632278, 565.6220183090121),
    );
}

/// Seed 23992: an orthogonal outline of 17 walls round a courtyard.
#[rustfmt::skip]
const SEED_23992: [WallRow; 17] = [
    (0.0, 341.6790883819166, 0.8333333333333334, 10.0),
    (118.96860323138358, 341.6790883819166, 0.8333333333333334, 3.0),
    (118.96860323138358, 56.705903406248794, 0.8333333333333334, 12.0),
    (237.93720646276716, 56.705903406248794, 0.8333333333333334, 10.0),
    (237.93720646276716, 341.6790883819166, 0.8333333333333334, 24.0),
    (237.93720646276716, 379.6627007776699, 0.8333333333333334, 20.0),
    (237.93720646276716, 429.72946690271857, 0.8333333333333334, 15.0),
    (475.87441292553433, 429.72946690271857, 0.8333333333333334, 5.0),
    (475.87441292553433, 516.7772244369859, 0.8333333333333334, 23.0),
    (356.9058096941508, 516.7772244369859, 0.8333333333333334, 22.0),
    (356.9058096941508, 644.3051833253912, 0.8333333333333334, 14.0),
    (356.9058096941508, 770.6480417758432, 0.8333333333333334, 11.0),
    (118.96860323138358, 770.6480417758432, 0.8333333333333334, 10.0),
    (118.96860323138358, 429.72946690271857, 0.8333333333333334, 19.0),
    (78.35695186526496, 429.7294669027186, 0.8333333333333334, 0.0),
    (46.91366433498036, 429.72946690271857, 0.8333333333333334, 20.0),
    (0.0, 429.72946690271857, 0.8333333333333334, 7.0),
];

#[rustfmt::skip]
const SEED_23992_COURTYARD: [WallRow; 4] = [
    (225.93810620698804, 546.6613863528264, 0.5, 9.0),
    (279.9877719071881, 546.6613863528264, 0.5, 16.0),
    (279.9877719071881, 587.8367290808872, 0.5, 5.0),
    (225.93810620698804, 587.8367290808872, 0.5, 3.0),
];

#[test]
fn a_hip_top_at_a_ridge_step_of_one_pitch_is_stepped_with_it() {
    let frame = framed(&SEED_23992, &[&SEED_23992_COURTYARD]);
    // The ridge along y = 473.579 ends east at x = 313.056, a hip end, and
    // runs on half a rafter to x = 313.806. A hip of 0.46 in (left out)
    // runs from there to the west end of the ridge along y = 473.253 at
    // x = 313.382. The hip rising from (328.062, 498.588) is cut to the
    // first ridge's north side, y = 474.329, and its cheek there ran on to
    // x = 314.381, where the other ridge's north side, y = 474.003, stood
    // 0.326 in back (a gap of 0.3256 in). Now the cheek is cut 0.326 in
    // deeper past x = 313.806 and bears on both. Derivation (nodes from
    // the solved roof's lines).
    assert_hip_top_stepped_at_ridge_end(
        &frame,
        dvec2(313.0563399003604, 473.578936696509),
        dvec2(313.38193092701715, 473.25334566985225),
    );
}

/// Seed 24590: an orthogonal outline of 10 walls, mixed pitches.
#[rustfmt::skip]
const SEED_24590: [WallRow; 10] = [
    (0.0, 413.57704097585065, 1.0833333333333333, 7.0),
    (287.7241754873504, 413.57704097585065, 0.8333333333333334, 24.0),
    (287.7241754873504, 270.5631619790799, 0.8414472472139711, 4.0),
    (516.3536068574541, 270.5631619790799, 1.0833333333333333, 21.0),
    (516.3536068574541, 655.3765497657159, 1.0, 20.0),
    (610.0352762193852, 655.3765497657159, 1.5, 19.0),
    (610.0352762193852, 270.5631619790799, 0.8333333333333334, 19.0),
    (1107.3754594231757, 270.5631619790799, 1.1283302576072403, 13.0),
    (1107.3754594231757, 0.0, 1.0833333333333333, 24.0),
    (0.0, 0.0, 1.3333333333333333, 17.0),
];

#[test]
fn a_hip_top_at_a_ridge_step_past_a_wing_is_stepped_with_it() {
    let frame = framed(&SEED_24590, &[]);
    // The ridge along y = 118.281 ends east at x = 524.610, a hip end, and
    // runs on half a rafter to x = 525.360. A hip of 0.80 in (left out)
    // runs from there to the west end of the ridge along y = 117.636 at
    // x = 525.076. The hip rising from (570.749, 200.530) is cut to the
    // first ridge's north side, y = 119.031, and its cheek there ran on to
    // x = 525.891, where the other ridge's north side, y = 118.386, stood
    // 0.645 in back (a gap of 0.6447 in). Now the cheek is cut 0.645 in
    // deeper past x = 525.360 and bears on both. Derivation (nodes from
    // the solved roof's lines).
    assert_hip_top_stepped_at_ridge_end(
        &frame,
        dvec2(524.6102386305727, 118.28082127681742),
        dvec2(525.0758292211234, 117.63615738220867),
    );
}
