# Reference GARCH(1,1) fit on the Deutschmark/British pound series of the Fiorentini, Calzolari and Panattoni (1996)
# GARCH benchmark (used by McCullough and Renfro 1998), as R's fGarch ships it (data set `dem2gbp`).
# Run from this folder: Rscript make-dem2gbp-fit.R
# Writes dem2gbp.csv (the 1,974 daily percent log returns, exactly as stored in fGarch) and dem2gbp-fit.csv
# (fGarch's fit with a constant mean and Gaussian errors, its defaults).
#
# Conventions checked here (see README.md): fGarch::garchFit reports fit$llh = minus the full Gaussian
# log-likelihood, summed over all n returns, with the recursion started at h[1] = omega + (alpha + beta) * mean(z^2),
# z = x - mu (the day before the sample gets the mean squared residual as its variance and squared shock);
# `loglik` below recomputes it by an explicit loop and the script stops if the two differ.
suppressMessages(library(fGarch))
data(dem2gbp)
x <- dem2gbp[, 1]
n <- length(x)
text <- as.character(x)
stopifnot(all(as.numeric(text) == x))  # the written text reads back to the same doubles

loglik <- function(x, mu, omega, alpha, beta) {
  z <- x - mu; n <- length(z)
  h <- numeric(n)
  h[1] <- omega + (alpha + beta) * mean(z^2)
  for (t in 2:n) h[t] <- omega + alpha * z[t-1]^2 + beta * h[t-1]
  -0.5 * sum(log(2*pi) + log(h) + z^2 / h)
}

f <- garchFit(~garch(1, 1), data = x, include.mean = TRUE, cond.dist = "norm", trace = FALSE)
cf <- coef(f); se <- f@fit$se.coef
ll <- -f@fit$llh[[1]]
chk <- loglik(x, cf[["mu"]], cf[["omega"]], cf[["alpha1"]], cf[["beta1"]])
stopifnot(abs(chk - ll) < 1e-9 * abs(ll))

header <- c(
  sprintf("# %s; fGarch %s; data fGarch::dem2gbp (Fiorentini, Calzolari and Panattoni 1996 benchmark series), n = %d percent log returns",
          R.version.string, packageVersion("fGarch"), n),
  "# garchFit(~garch(1, 1), data = x, include.mean = TRUE, cond.dist = \"norm\"); log_likelihood: full Gaussian incl. 1/2 ln(2 pi) terms over all n returns, in percent units; start h1 = omega + (alpha + beta) * mean((x - mu)^2); se_*: fGarch's se.coef")
writeLines(header, "dem2gbp-fit.csv")
out <- data.frame(mu = cf[["mu"]], omega = cf[["omega"]], alpha = cf[["alpha1"]], beta = cf[["beta1"]],
                  log_likelihood = ll, se_mu = se[["mu"]], se_omega = se[["omega"]], se_alpha = se[["alpha1"]],
                  se_beta = se[["beta1"]])
out[] <- lapply(out, function(v) sprintf("%.17g", v))
suppressWarnings(write.table(out, "dem2gbp-fit.csv", sep = ",", row.names = FALSE, quote = FALSE, append = TRUE))
writeLines(c(sprintf("# fGarch::dem2gbp (fGarch %s): %d daily percent log returns of the Deutschmark/British pound rate, the series of the Fiorentini, Calzolari and Panattoni (1996) GARCH benchmark; written by make-dem2gbp-fit.R",
               packageVersion("fGarch"), n),
             "return_percent", text), "dem2gbp.csv")
