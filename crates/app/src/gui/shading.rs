//! The shading of the 3D view: one light and an even ambient, per pixel.
//!
//! three-d's physical material evaluates a full lighting model for every
//! pixel of every board, which software OpenGL runs on the CPU; that cost
//! set the frame time of the whole window. Timber, walls and roof planes
//! read as well with plain diffuse light, which costs a dot product a
//! pixel.

use three_d::{
    Blend, ColorMapping, Cull, EffectMaterialId, InnerSpace, Light, Material, MaterialType, Program,
    RenderStates, Srgba, Vec3, Viewer, WriteMask,
};

/// Share of a surface's colour it shows with no direct light on it.
const AMBIENT: f32 = 0.55;

/// Share added when the light falls square on a surface.
const DIFFUSE: f32 = 0.6;

/// Our material's shader id, in the range three-d leaves to users.
const SHADED_MATERIAL_ID: u16 = 0x0100;

/// A flat colour lit by one directional light plus ambient, both sides of
/// a face alike (a board's far face is lit as its near face would be).
#[derive(Debug, Clone, Copy)]
pub struct ShadedMaterial {
    /// The surface colour (sRGB) and opacity.
    pub color: Srgba,
    /// Light the surface gives off of its own, added after shading (sRGB).
    pub emissive: Srgba,
    /// The direction the light travels, in world space.
    pub light_direction: Vec3,
    /// Whether `color`'s alpha is drawn blended over what is behind.
    pub transparent: bool,
    /// Whether faces seen from behind are left out: true only for closed
    /// solids wound counter-clockwise from outside (the members), whose
    /// far faces are always hidden by their near ones. Software OpenGL
    /// then sets up half the triangles.
    pub cull_back: bool,
}

impl ShadedMaterial {
    /// A material of `color`, transparent when its alpha is under 255.
    pub fn new(color: Srgba) -> Self {
        Self {
            color,
            emissive: Srgba::new(0, 0, 0, 255),
            light_direction: Vec3::new(0.0, 0.0, -1.0),
            transparent: color.a < 255,
            cull_back: false,
        }
    }
}

impl Material for ShadedMaterial {
    fn fragment_shader_source(&self, _lights: &[&dyn Light]) -> String {
        let mut source = String::from(ColorMapping::fragment_shader_source());
        source.push_str(
            "
uniform vec4 surfaceColor;
uniform vec3 emissiveColor;
uniform vec3 lightDirection;
uniform float ambient;
uniform float diffuse;

in vec3 nor;
in vec4 col;

layout (location = 0) out vec4 outColor;

void main()
{
    vec3 normal = normalize(gl_FrontFacing ? nor : -nor);
    float facing = max(dot(normal, -lightDirection), 0.0);
    vec3 rgb = surfaceColor.rgb * col.rgb * (ambient + diffuse * facing) + emissiveColor;
    outColor = vec4(color_mapping(rgb), surfaceColor.a * col.a);
}
",
        );
        source
    }

    fn id(&self) -> EffectMaterialId {
        EffectMaterialId(SHADED_MATERIAL_ID)
    }

    fn use_uniforms(&self, program: &Program, viewer: &dyn Viewer, _lights: &[&dyn Light]) {
        viewer.color_mapping().use_uniforms(program);
        program.use_uniform("surfaceColor", self.color.to_linear_srgb());
        let emissive = self.emissive.to_linear_srgb();
        program.use_uniform("emissiveColor", Vec3::new(emissive.x, emissive.y, emissive.z));
        let direction = if self.light_direction.magnitude2() > 0.0 {
            self.light_direction.normalize()
        } else {
            Vec3::new(0.0, 0.0, -1.0)
        };
        program.use_uniform("lightDirection", direction);
        program.use_uniform("ambient", AMBIENT);
        program.use_uniform("diffuse", DIFFUSE);
    }

    fn render_states(&self) -> RenderStates {
        if self.transparent {
            RenderStates { write_mask: WriteMask::COLOR, blend: Blend::TRANSPARENCY, ..Default::default() }
        } else if self.cull_back {
            RenderStates { cull: Cull::Back, ..Default::default() }
        } else {
            RenderStates::default()
        }
    }

    fn material_type(&self) -> MaterialType {
        if self.transparent { MaterialType::Transparent } else { MaterialType::Opaque }
    }
}
