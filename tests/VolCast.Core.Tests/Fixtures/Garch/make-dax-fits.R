# Reference GARCH(1,1) and GJR-GARCH(1,1) fits on the DAX closes shipped with base R (datasets::EuStockMarkets).
# Run from this folder: Rscript make-dax-fits.R
# Writes dax-close.csv (the 1,860 closes, business-daily 1991-1998) and dax-fits.csv (one row per reference fit).
#
# Conventions checked here and pinned in the fixture (see README.md):
# - fGarch::garchFit reports fit$llh = minus the full Gaussian log-likelihood (the 1/2 ln 2 pi terms included),
#   summed over all n returns, with the variance recursion started at h[1] = omega + persistence * mean(z^2)
#   ("mci"); `llh_check` below recomputes it by an explicit loop to prove that.
# - tseries::garch (no mean) reports the Gaussian log-likelihood summed over t = 2..n with h[1] = mean(x^2)
#   (the loop below prints the difference for each start and first term; "var" from 2 is the one that is ~0).
suppressMessages({library(fGarch); library(tseries)})
x <- as.numeric(EuStockMarkets[, "DAX"])
r <- diff(log(x))
n <- length(r)

loglik <- function(r, mu, omega, alpha, beta, gamma = 0, init = "mci", from = 1, h1 = NA) {
  z <- r - mu; n <- length(z)
  P <- alpha + beta + gamma / 2
  h <- numeric(n)
  h[1] <- switch(init, mci = omega + P * mean(z^2), var = mean(z^2), sd = var(z), fixed = h1)
  for (t in 2:n) h[t] <- omega + (alpha + gamma * (z[t-1] < 0)) * z[t-1]^2 + beta * h[t-1]
  -0.5 * sum((log(2*pi) + log(h) + z^2 / h)[from:n])
}

rows <- list()
add <- function(source, model, include_mean, init, lik_from, mu, omega, alpha, beta, gamma, ll, se, h1 = NA) {
  rows[[length(rows) + 1]] <<- data.frame(source = source, model = model, include_mean = include_mean,
    init = init, lik_from = lik_from, mu = mu, omega = omega, alpha = alpha, beta = beta, gamma = gamma,
    log_likelihood = ll, h1 = h1, se_mu = se[1], se_omega = se[2], se_alpha = se[3], se_beta = se[4], se_gamma = se[5])
}

for (im in c(TRUE, FALSE)) {
  f <- garchFit(~garch(1, 1), data = r, include.mean = im, cond.dist = "norm", trace = FALSE)
  cf <- coef(f); se <- f@fit$se.coef
  mu <- if (im) cf[["mu"]] else 0
  ll <- -f@fit$llh[[1]]
  chk <- loglik(r, mu, cf[["omega"]], cf[["alpha1"]], cf[["beta1"]], init = "mci")
  stopifnot(abs(chk - ll) < 1e-9 * abs(ll))
  add("fGarch", "garch", im, "mci", 1, mu, cf[["omega"]], cf[["alpha1"]], cf[["beta1"]], 0, ll,
      c(if (im) se[["mu"]] else NA, se[["omega"]], se[["alpha1"]], se[["beta1"]], NA))
}

# GJR through fGarch's APARCH with delta = 2: h = omega + alpha (|z| - g z)^2 + beta h.
# For z < 0 the ARCH weight is alpha (1 + g)^2, for z >= 0 alpha (1 - g)^2, so in GJR terms
# alpha_gjr = alpha (1 - g)^2 and gamma_gjr = 4 alpha g; persistence beta + alpha (1 + g^2) is the same number.
f <- garchFit(~aparch(1, 1), data = r, delta = 2, include.delta = FALSE, include.mean = TRUE,
              cond.dist = "norm", trace = FALSE)
cf <- coef(f)
a <- cf[["alpha1"]]; g <- cf[["gamma1"]]
ag <- a * (1 - g)^2; gg <- 4 * a * g
ll <- -f@fit$llh[[1]]
# With the leverage term fGarch starts the recursion at omega + (alpha + beta) * mean(z^2), leaving out the
# leverage part of the persistence, so the "mci" start in GJR terms does not reproduce its likelihood; the
# start value it used (h1) is recorded instead, and with it the loop reproduces fGarch's log-likelihood.
h1 <- f@fit$series$h[1]
chk <- loglik(r, cf[["mu"]], cf[["omega"]], ag, cf[["beta1"]], gg, init = "fixed", h1 = h1)
stopifnot(abs(chk - ll) < 1e-9 * abs(ll))
add("fGarch", "gjr-garch", TRUE, "fixed", 1, cf[["mu"]], cf[["omega"]], ag, cf[["beta1"]], gg, ll, rep(NA, 5), h1 = h1)

t1 <- garch(r, order = c(1, 1), trace = FALSE)
cf <- coef(t1); se <- summary(t1)$coef[, 2]
ll <- as.numeric(logLik(t1))
# Which start and which sum reproduce tseries' reported log-likelihood? (printed for the README)
for (init in c("mci", "var", "sd")) for (from in 1:2)
  cat("tseries check init=", init, " from=", from, ": ",
      loglik(r, 0, cf[["a0"]], cf[["a1"]], cf[["b1"]], init = init, from = from) - ll, "\n", sep = "")
add("tseries", "garch", FALSE, "var", 2, 0, cf[["a0"]], cf[["a1"]], cf[["b1"]], 0, ll,
    c(NA, se[["a0"]], se[["a1"]], se[["b1"]], NA))

out <- do.call(rbind, rows)
header <- c(
  sprintf("# %s; fGarch %s; tseries %s; data datasets::EuStockMarkets[, \"DAX\"], n = %d log returns",
          R.version.string, packageVersion("fGarch"), packageVersion("tseries"), n),
  "# log_likelihood: full Gaussian incl. 1/2 ln(2 pi) terms, summed from return number lik_from; init: start of the variance recursion (mci = omega + persistence * mean(z^2), var = mean(z^2), fixed = h1); se_*: as the package reports them")
writeLines(header, "dax-fits.csv")
num <- vapply(out, is.numeric, logical(1))
out[num] <- lapply(out[num], function(v) ifelse(is.na(v), "", sprintf("%.17g", v)))
suppressWarnings(write.table(out, "dax-fits.csv", sep = ",", row.names = FALSE, quote = FALSE, append = TRUE))
write.table(data.frame(close = sprintf("%.2f", x)), "dax-close.csv", row.names = FALSE, quote = FALSE)
