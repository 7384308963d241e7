#include "app/batch/study_variants.hpp"

#include "app/model_builder.hpp"
#include "core/text_format.hpp"
#include "io/input_error.hpp"

namespace rotcap::app {

namespace {

/// The amplitude times f, in the form it was written ("b/200" x 2 = "b/100").
OverrideValue scaled_amplitude(const Amplitude& a, double f) {
  if (a.kind == Amplitude::Kind::millimetres) return override_number(a.millimetres * f);
  return override_string(a.base + "/" + format_text("%g", a.divisor / f));
}

VariantClaims claims_of(const CaseInput& c) {
  VariantClaims k;
  k.flange_elements = c.zone.flange_elements;
  k.web_elements = c.zone.web_elements;
  k.first_step = c.analysis.path.first_step;
  k.local = enum_name(c.imperfection.local);
  if (c.imperfection.local == LocalImperfection::buckling_mode) k.mode = c.imperfection.mode;
  k.sign = c.imperfection.sign;
  k.local_amplitude = c.imperfection.local_amplitude.text;
  return k;
}

}  // namespace

std::vector<StudyVariant> study_variants(const CaseInput& base) {
  if (base.kind != ModelKind::generated)
    throw InputError(base.file, 0, "model", "a general model", "a generated hinge-zone model ([section] + [member]) for a study");
  if (base.imperfection.local == LocalImperfection::none)
    throw InputError(base.file, 0, "imperfection.local", "\"none\"",
                     "\"buckling_mode\" or \"half_sine\": the study varies the local imperfection");
  std::vector<StudyVariant> v;
  const VariantClaims own = claims_of(base);
  v.push_back({"base", "the case as written", {}, own});
  {
    const MeshCounts m = scaled_mesh_counts(base.zone.flange_elements, base.zone.web_elements, 1.5);
    StudyVariant s{"mesh_x1.5", format_text("mesh x1.5 (%d x %d)", m.flange_elements, m.web_elements),
                   {{"mesh.flange_elements", override_integer(m.flange_elements)},
                    {"mesh.web_elements", override_integer(m.web_elements)}},
                   own};
    s.claims.flange_elements = m.flange_elements;
    s.claims.web_elements = m.web_elements;
    v.push_back(s);
  }
  {
    const double step = 0.5 * base.analysis.path.first_step;
    StudyVariant s{"step_x0.5", "step x0.5 (first_step " + format_number(step) + ")",
                   {{"analysis.first_step", override_number(step)},
                    {"analysis.max_steps", override_integer(2LL * base.analysis.path.max_steps)}},
                   own};
    s.claims.first_step = step;
    v.push_back(s);
  }
  for (const double f : {0.5, 2.0}) {
    const OverrideValue a = scaled_amplitude(base.imperfection.local_amplitude, f);
    StudyVariant s{format_text("amplitude_x%g", f), format_text("local amplitude x%g (", f) + a.display + ")",
                   {{"imperfection.local_amplitude", a}}, own};
    s.claims.local_amplitude = a.display;
    v.push_back(s);
  }
  const bool base_is_mode = base.imperfection.local == LocalImperfection::buckling_mode;
  for (int mode = 1; mode <= 3; ++mode)
    for (const int sign : {1, -1}) {
      if (base_is_mode && base.imperfection.mode == mode && base.imperfection.sign == sign) continue;
      const std::string word = sign > 0 ? "positive" : "negative";
      StudyVariant s{format_text("mode%d_", mode) + word, format_text("mode %d, ", mode) + word + " sign",
                     {{"imperfection.local", override_string("buckling_mode")},
                      {"imperfection.mode", override_integer(mode)},
                      {"imperfection.sign", override_integer(sign)}},
                     own};
      s.claims.local = "buckling_mode";
      s.claims.mode = mode;
      s.claims.sign = sign;
      v.push_back(s);
    }
  if (base.imperfection.local != LocalImperfection::half_sine) {
    StudyVariant s{"half_sine", "half-sine flange pattern",
                   {{"imperfection.local", override_string("half_sine")},
                    {"imperfection.mode", override_removal()},
                    {"imperfection.sign", override_integer(1)}},
                   own};
    s.claims.local = "half_sine";
    s.claims.mode.reset();
    s.claims.sign = 1;
    v.push_back(s);
  }
  return v;
}

}  // namespace rotcap::app
