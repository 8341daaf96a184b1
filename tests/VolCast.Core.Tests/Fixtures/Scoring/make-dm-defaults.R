# forecast::dm.test with its defaults (varestimator = "acf", the rectangular window; alternative = "two.sided";
# power = 2) on the committed scoring series, at h = 1 (the default), 5 and 21.
# Run from this folder:  Rscript make-dm-defaults.R
# Needs (Debian): r-base-core, r-cran-forecast, r-cran-jsonlite. Reads scoring-series.csv; writes dm-defaults.json.
suppressPackageStartupMessages({
  library(forecast)
  library(jsonlite)
})
s <- read.csv("scoring-series.csv")
e1 <- s$forecast - s$realized
e2 <- s$implied - s$realized
d <- e1^2 - e2^2
n <- length(d)

case <- function(h) {
  r <- if (h == 1) dm.test(e1, e2) else dm.test(e1, e2, h = h)
  # The rectangular long-run variance dm.test starts from: gamma_0 + 2 * sum(gamma_1..h-1), acf covariances
  # (mean removed, divisor n). When it is not positive dm.test falls back to h = 1; the cases kept here have it positive.
  g <- acf(d, lag.max = h - 1, type = "covariance", plot = FALSE)$acf[, , 1]
  v <- sum(c(g[1], 2 * g[-1]))
  list(h = h, statistic = unname(r$statistic), p_value = r$p.value, rectangular_variance = v)
}
cases <- lapply(c(1, 5, 21), case)
names(cases) <- c("h1", "h5", "h21")
stopifnot(all(vapply(cases, function(x) x$rectangular_variance > 0, logical(1))))

out <- list(
  r_version = R.version.string,
  forecast_version = as.character(packageVersion("forecast")),
  call = "dm.test(e1, e2, h = h) with every other argument at its default; e1 = forecast - realized, e2 = implied - realized from scoring-series.csv",
  n = n,
  cases = cases)
writeLines(toJSON(out, auto_unbox = TRUE, digits = NA, pretty = TRUE), "dm-defaults.json")
