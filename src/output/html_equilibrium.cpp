// The equilibrium section of the calculation package: for the governing combinations, the
// actions the cap puts on the pile heads (the solver's head_forces, head moments included)
// summed about the origin beside the applied resultant, and the hand check of the governing
// pile — the closed form where it is exact (explain.hpp), else the rigid cap's general
// equations with the numbers substituted.
#include <algorithm>
#include <cmath>
#include <set>

#include <fmt/format.h>

#include "cairn/checks/explain.hpp"
#include "cairn/geotechnics/stiffness.hpp"
#include "cairn/output/html_package.hpp"
#include "cairn/output/html_report.hpp"
#include "cairn/output/markup.hpp"
#include "cairn/output/number_text.hpp"
#include "cairn/solver/head_forces.hpp"
#include "cairn/solver/pile_head.hpp"

namespace cairn {
namespace {

// Numbers in the project's units with the precision of the report's tables.
struct Shown {
  UnitSystem u;
  bool si() const { return u == UnitSystem::SI; }
  std::string force(double v) const { return fixed_text(from_si(u, Quantity::force, v), si() ? 1 : 2); }
  std::string moment(double v) const { return fixed_text(from_si(u, Quantity::moment, v), si() ? 1 : 2); }
  std::string length(double v) const { return fixed_text(from_si(u, Quantity::length, v), si() ? 3 : 2); }
  std::string small(double v) const { return fixed_text(from_si(u, Quantity::small_length, v), 3); }
  std::string stiffness(double v) const { return fixed_text(from_si(u, Quantity::stiffness, v), si() ? 0 : 2); }
  std::string f() const { return unit_label(u, Quantity::force); }
  std::string m() const { return unit_label(u, Quantity::moment); }
  std::string l() const { return unit_label(u, Quantity::length); }
  std::string mm() const { return unit_label(u, Quantity::small_length); }
  std::string k() const { return unit_label(u, Quantity::stiffness); }
  std::string vector(const std::array<double, 3>& v, std::string (Shown::*one)(double) const) const {
    return "(" + (this->*one)(v[0]) + ", " + (this->*one)(v[1]) + ", " + (this->*one)(v[2]) + ")";
  }
};

std::string rad(double v) { return std::abs(v) < 1e-300 ? std::string("0") : fmt::format("{:.4e}", v); }

std::string eq(const std::string& text) { return "<div class=\"eq\">" + html_escape(text) + "</div>\n"; }

// Σ of the pile forces and their moments about the origin, beside the applied resultant.
std::string balance_table(const CheckReport& r, const std::vector<PileSpring>& springs,
                          std::size_t index) {
  const Project& p = *r.project;
  const CombinationCheck& cc = r.results->combinations[index];
  const Combination& c = p.combinations[cc.combination];
  const Shown s{p.units};
  std::string html = "<h3 id=\"equilibrium-" + attribute_escape(std::to_string(index)) + "\">" +
                     html_escape(c.id) + " (" + to_string(c.limit_state) + "): " +
                     html_escape(combination_formula(p, c)) + "</h3>\n";
  if (cc.solution.overturns) {
    html += "<p class=\"note fail\">No equilibrium exists on the piles (" +
            html_escape(cc.solution.failure) + "), so there are no pile forces to sum.</p>\n";
    return html;
  }
  const HeadBalance b = head_balance(springs, cc.solution, combination_load(p, c));
  // Head moment columns where some pile's head is not pinned.
  bool held = false;
  for (const auto& pile : p.piles)
    if (p.pile_types[pile.type].head != HeadFixity::pinned) held = true;
  Table t;
  t.title = held ? "Forces and moments of the cap on the pile heads, and their moments about "
                   "the origin, " + c.id
                 : "Forces on the pile heads and their moments about the origin, " + c.id;
  const std::string f = s.f(), m = s.m(), l = s.l();
  t.headers = {"pile", "x (" + l + ")", "y (" + l + ")", "N (" + f + ")", "Fx (" + f + ")",
               "Fy (" + f + ")", "Fz (" + f + ")"};
  if (held)
    for (const char* axis : {"x", "y", "z"})
      t.headers.push_back(std::string("head M") + axis + " (" + m + ")");
  // With head moments beside them, the moments about the origin say so.
  for (const char* axis : {"Mx", "My", "Mz"})
    t.headers.push_back(std::string(axis) + (held ? " about origin (" : " (") + m + ")");
  t.numeric.assign(t.headers.size(), true);
  t.numeric[0] = false;
  Wrench heads{};
  for (std::size_t i = 0; i < b.piles.size() && i < p.piles.size(); ++i) {
    const Wrench& w = b.piles[i];
    const auto& h = springs[i].head;
    std::vector<std::string> row = {p.piles[i].id, s.length(h[0]), s.length(h[1]),
                                    s.force(cc.piles[i].axial)};
    for (int k = 0; k < 3; ++k) row.push_back(s.force(w[k]));
    if (held)
      for (int k = 3; k < 6; ++k) {
        heads[k] += cc.solution.piles[i].head_forces[k];
        row.push_back(s.moment(cc.solution.piles[i].head_forces[k]));
      }
    for (int k = 3; k < 6; ++k) row.push_back(s.moment(w[k]));
    t.rows.push_back(row);
  }
  auto total_row = [&](const std::string& name, const Wrench& w, bool with_heads) {
    std::vector<std::string> row = {name, "", "", ""};
    for (int k = 0; k < 3; ++k) row.push_back(s.force(w[k]));
    if (held)
      for (int k = 3; k < 6; ++k) row.push_back(with_heads ? s.moment(heads[k]) : std::string());
    for (int k = 3; k < 6; ++k) row.push_back(s.moment(w[k]));
    t.rows.push_back(row);
  };
  total_row("Σ piles", b.sum, true);
  total_row("applied", b.applied, false);
  total_row("residual", b.residual, false);
  html += render_table_html(t);
  html += fmt::format("<p class=\"note\">Residual = Σ piles − applied; its largest component "
                      "is {} of the largest applied component (moments divided by {} {}, the "
                      "largest distance of a pile head from the origin, so that forces and "
                      "moments compare in one unit). The solver's own check, about its "
                      "reference point: {:.1e}.</p>\n",
                      fmt::format("{:.1e}", b.relative), s.length(b.lever), l,
                      cc.solution.residual);
  return html;
}

// The rigid cap's equations with the governing pile's numbers, where no closed form applies.
std::string general_equations(const CheckReport& r, const std::vector<PileSpring>& springs,
                              std::size_t index, std::size_t pile) {
  const Project& p = *r.project;
  const CombinationCheck& cc = r.results->combinations[index];
  const Combination& c = p.combinations[cc.combination];
  const Shown s{p.units};
  std::string html =
      "<p>The rigid cap has six degrees of freedom: the translation t of the cap point at the "
      "reference point c and the rotation r. Each pile head is an axial spring k_a along its "
      "axis a (head to toe) and a lateral spring k_l across it (Hrennikoff 1949; Saul "
      "1968):</p>\n";
  html += eq("K_i = k_a·a·aᵀ + k_l·(I − a·aᵀ),   T_i = [I | −[p_i − c]×]");
  html += eq("K_cap = Σ T_iᵀ·K_i·T_i,   K_cap·U = F_c   (U = [t, r]; F_c the applied forces and "
             "moments about c)");
  html += eq("u_i = t + r × (p_i − c),   N_i = k_a·(a·u_i),   V_i = k_l·|u_i − (a·u_i)·a|");
  if (cc.solution.overturns) return html;
  const CapMovement& mv = cc.solution.movement;
  const Wrench load = combination_load(p, c, mv.reference);
  html += fmt::format("<p>Substituted for {} and pile {}:</p>\n", html_escape(c.id),
                      html_escape(p.piles[pile].id));
  html += eq(fmt::format("c = {} {} (the group's elastic centre)", s.vector(mv.reference, &Shown::length), s.l()));
  html += eq(fmt::format("F_c = ({}, {}, {}) {}, ({}, {}, {}) {}", s.force(load[0]), s.force(load[1]),
                         s.force(load[2]), s.f(), s.moment(load[3]), s.moment(load[4]),
                         s.moment(load[5]), s.m()));
  html += eq(fmt::format("t = {} {},   r = ({}, {}, {}) rad", s.vector(mv.translation_at_reference, &Shown::small),
                         s.mm(), rad(mv.rotation[0]), rad(mv.rotation[1]), rad(mv.rotation[2])));
  const PileSpring& k = springs[pile];
  const std::array<double, 3> d = {k.head[0] - mv.reference[0], k.head[1] - mv.reference[1],
                                   k.head[2] - mv.reference[2]};
  html += eq(fmt::format("p − c = {} {},   a = ({:.4f}, {:.4f}, {:.4f}),   k_a = {} {},   k_l = {} {}",
                         s.vector(d, &Shown::length), s.l(), k.axis[0], k.axis[1], k.axis[2],
                         s.stiffness(k.axial), s.k(), s.stiffness(k.lateral), s.k()));
  const auto u = head_displacement(k, mv);
  const double along = k.axis[0] * u[0] + k.axis[1] * u[1] + k.axis[2] * u[2];
  html += eq(fmt::format("u = t + r × (p − c) = {} {},   a·u = {} {}", s.vector(u, &Shown::small), s.mm(),
                         s.small(along), s.mm()));
  const bool active = cc.solution.piles[pile].active;
  html += eq(fmt::format("N = k_a·(a·u) = {} {} × {} {} = {} {}{}   (solver: {} {})",
                         s.stiffness(k.axial), s.k(), s.small(along), s.mm(),
                         s.force(active ? k.axial * along : 0.0), s.f(),
                         active ? "" : " (dropped out: no axial spring)",
                         s.force(cc.piles[pile].axial), s.f()));
  if (k.bending.any()) {
    // A head held against rotation: the bending terms of pile_head.hpp, with numbers.
    const HeadBending& hb = k.bending;
    html += eq("held head: F = k_a·(a·u)·a + k_l·(u − (a·u)·a) + K_lr·(a × r),   M = K_lr·(u × a) "
               "+ K_rr·(r − (a·r)·a) + k_t·(a·r)·a");
    html += eq(fmt::format("K_lr = {} {}/rad,   K_rr = {} {}/rad,   k_t = {} {}/rad", s.force(hb.coupling),
                           s.f(), s.moment(hb.rotational), s.m(), s.moment(hb.torsional), s.m()));
    const double uu[3] = {u[0], u[1], u[2]};
    const double w[3] = {mv.rotation[0], mv.rotation[1], mv.rotation[2]};
    double fb[3], mb[3];
    head_bending_action<double>(k.axis, hb, uu, w, fb, mb);
    std::array<double, 3> force{}, moment{};
    const double axial = active ? k.axial : 0.0;
    for (int j = 0; j < 3; ++j) {
      force[j] = axial * along * k.axis[j] + k.lateral * (u[j] - along * k.axis[j]) + fb[j];
      moment[j] = mb[j];
    }
    const Wrench& a = cc.solution.piles[pile].head_forces;
    html += eq(fmt::format("F = {} {},   M = {} {}   (solver: {} {}, {} {})",
                           s.vector(force, &Shown::force), s.f(), s.vector(moment, &Shown::moment), s.m(),
                           s.vector({a[0], a[1], a[2]}, &Shown::force), s.f(),
                           s.vector({a[3], a[4], a[5]}, &Shown::moment), s.m()));
  }
  return html;
}

}  // namespace

std::vector<std::size_t> governing_combinations(const CheckResults& results) {
  std::set<std::size_t> chosen;
  if (results.summary.combination) {
    for (std::size_t i = 0; i < results.combinations.size(); ++i)
      if (results.combinations[i].combination == *results.summary.combination) chosen.insert(i);
  }
  // The combination of the largest compression, tension and lateral force over all piles.
  auto largest = [&](auto value) {
    double best = 0.0;
    std::optional<std::size_t> where;
    for (std::size_t i = 0; i < results.combinations.size(); ++i) {
      const auto& cc = results.combinations[i];
      if (cc.solution.overturns) continue;
      for (const auto& pc : cc.piles)
        if (value(pc) > best) best = value(pc), where = i;
    }
    if (where) chosen.insert(*where);
  };
  largest([](const PileCheck& c) { return c.axial; });
  largest([](const PileCheck& c) { return -c.axial; });
  largest([](const PileCheck& c) { return c.lateral; });
  for (std::size_t i = 0; i < results.combinations.size(); ++i)
    if (results.combinations[i].solution.overturns) chosen.insert(i);
  return {chosen.begin(), chosen.end()};
}

std::string render_equilibrium_section_html(const CheckReport& r) {
  if (!r.project || !r.results || r.results->combinations.empty()) return "";
  const Project& p = *r.project;
  std::vector<PileSpring> springs =
      r.stiffness ? pile_springs(p, *r.stiffness) : pile_springs(p);
  std::string html = "<section class=\"equilibrium\" id=\"equilibrium\">\n<h2>Equilibrium "
                     "and hand check</h2>\n";
  html += "<p>For the governing combinations (largest utilization, largest compression, "
          "tension and lateral force, and any that overturns): the action of the cap on each "
          "pile head as the solver returns it, in global axes — the force F (N is the axial "
          "force, compression positive, so a compression pile has Fz &lt; 0; a battered "
          "pile's axial force has horizontal components) and, for fixed and partially fixed "
          "heads, the head moment M (zero for a pinned head) — and its moment about the "
          "origin, p × F + M. The pile's reaction on the cap is the opposite, so the cap is "
          "in equilibrium when these actions add up to the resultant of the applied loads "
          "about the origin (load heights and the cap's self-weight included), which is set "
          "beside their sum; the residual, Σ piles − applied, should read 0.</p>\n";
  const auto chosen = governing_combinations(*r.results);
  for (std::size_t index : chosen) html += balance_table(r, springs, index);

  // The hand check of the governing pile in the governing combination.
  const CheckSummary& sum = r.results->summary;
  if (sum.pile && sum.combination) {
    const std::size_t pile = *sum.pile;
    std::size_t index = 0;
    for (std::size_t i = 0; i < r.results->combinations.size(); ++i)
      if (r.results->combinations[i].combination == *sum.combination) index = i;
    std::vector<double> axial;
    if (r.stiffness)
      for (const auto& k : *r.stiffness) axial.push_back(k.axial);
    const auto checks = explain_pile(p, *r.results, pile, axial);
    const HandCheck* h = nullptr;
    for (const auto& c : checks)
      if (c.combination == *sum.combination) h = &c;
    html += "<h3 id=\"hand-check-governing\">Hand check of pile " + html_escape(p.piles[pile].id) +
            " in " + html_escape(p.combinations[*sum.combination].id) + "</h3>\n";
    if (h && h->available) {
      CheckReport one = r;
      one.explain_pile = pile;
      one.hand_checks = {*h};
      const bool heads = h->heads_moment_x != 0.0 || h->heads_moment_y != 0.0;
      html += "<p>All active piles are vertical with equal axial springs: the closed form "
              "applies (as <code>cairn check --explain " +
              html_escape(p.piles[pile].id) + "</code> prints it)." +
              (heads ? std::string(" The heads are held against rotation: the moments the cap "
                                   "puts on them (Σ of the head Mx, My in the table above) "
                                   "take part of the applied moments, and the axial forces "
                                   "carry the rest.")
                     : std::string()) +
              "</p>\n<pre>" +
              html_escape(hand_check_text(one)) + "</pre>\n";
    } else {
      html += "<p>No one-line formula applies here" +
              (h ? ": " + html_escape(h->why_not) : std::string()) +
              ". The general equations of the rigid cap follow, with this pile's numbers.</p>\n";
      html += general_equations(r, springs, index, pile);
    }
  }
  return html + "</section>";
}

}  // namespace cairn
