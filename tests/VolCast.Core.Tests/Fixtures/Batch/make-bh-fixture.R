# Makes bh-reference.csv: Benjamini-Hochberg adjusted p-values from R's stats::p.adjust(method = "BH"),
# the independent recomputation that FalseDiscoveryRateTests checks against.
# Run from this folder: Rscript make-bh-fixture.R
set.seed(20261201)
cases <- list(
  # 1. Mixed small and large p-values, as from one DM test per name.
  c(0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.3240, 0.4262, 0.5719, 0.6528, 0.7590, 1.0000),
  # 2. Ties and exact zeros and ones.
  c(0.01, 0.01, 0.03, 0.03, 0.03, 0.5, 0, 1, 0.04),
  # 3. Random uniform p-values mixed with a few strong signals (40 names).
  c(runif(34), rbeta(6, 0.2, 20)),
  # 4. A single p-value.
  c(0.2)
)
out <- file("bh-reference.csv", "w")
writeLines(sprintf("# R %s, stats %s; p.adjust(p, method = \"BH\"); seed 20261201", getRversion(), packageVersion("stats")), out)
writeLines("case,index,p,bh", out)
for (k in seq_along(cases)) {
  p <- cases[[k]]
  adj <- p.adjust(p, method = "BH")
  for (i in seq_along(p)) {
    writeLines(sprintf("%d,%d,%.17g,%.17g", k, i, p[i], adj[i]), out)
  }
}
close(out)
