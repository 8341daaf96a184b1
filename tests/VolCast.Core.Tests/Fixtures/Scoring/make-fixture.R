# Reference fixtures for VolCast's scoring layer (src/VolCast.Core/Scoring).
# Run from this folder:  Rscript make-fixture.R
# Needs (Debian): r-base-core, r-cran-sandwich, r-cran-lmtest, r-cran-jsonlite, r-cran-forecast.
# Writes: scoring-series.csv (the committed input series) and scoring-reference.json (R's numbers).
suppressPackageStartupMessages({
  library(sandwich)
  library(lmtest)
  library(jsonlite)
  library(forecast)
})

set.seed(20240604)
n <- 400
h <- 5  # overlapping h-day targets: errors follow an MA(h-1)

# A persistent daily variance path (log AR(1)), annualized volatility around 20%.
logv <- numeric(n + h)
logv[1] <- log(0.2^2)
for (t in 2:(n + h)) logv[t] <- log(0.2^2) * 0.05 + 0.95 * logv[t - 1] + rnorm(1, sd = 0.15)
truevar <- exp(logv)
# Realized variance over t+1..t+h: mean of h noisy daily proxies, so successive targets overlap.
daily <- truevar * rnorm(n + h)^2
realized_var <- sapply(1:n, function(t) mean(daily[(t + 1):(t + h)]))
forecast_var <- truevar[1:n] * exp(rnorm(n, sd = 0.20))        # a noisy forecast
implied_var <- 1.15 * truevar[1:n] * exp(rnorm(n, sd = 0.10))  # implied with a premium
# Volatilities (decimal), rounded to 12 significant digits; everything below uses the rounded values.
realized <- signif(sqrt(realized_var), 12)
forecast_vol <- signif(sqrt(forecast_var), 12)
implied <- signif(sqrt(implied_var), 12)
write.csv(data.frame(realized = sprintf("%.12g", realized), forecast = sprintf("%.12g", forecast_vol),
                     implied = sprintf("%.12g", implied)),
          "scoring-series.csv", row.names = FALSE, quote = FALSE)

rv2 <- realized^2; f2 <- forecast_vol^2; iv2 <- implied^2

hac <- function(fit, lag) NeweyWest(fit, lag = lag, prewhite = FALSE, adjust = FALSE)

# Mincer-Zarnowitz on variance, HAC lag h-1, Wald test of a = 0, b = 1.
mz <- lm(rv2 ~ f2)
mz_cov <- hac(mz, h - 1)
diff <- coef(mz) - c(0, 1)
mz_wald <- as.numeric(t(diff) %*% solve(mz_cov) %*% diff)
mz_cov0 <- hac(mz, 0)    # lag 0: White's heteroskedasticity-consistent (HC0) covariance
mz_cov12 <- hac(mz, 12)  # a longer lag

# Encompassing: RV^2 = a + b IV^2 + c F^2 + e, HAC lag h-1; t with n - 3 df (lmtest::coeftest default for lm).
enc <- lm(rv2 ~ iv2 + f2)
enc_cov <- hac(enc, h - 1)
enc_ct <- coeftest(enc, vcov. = enc_cov)

# Diebold-Mariano (forecast::dm.test, which applies the HLN correction and t(n-1) p-values).
e1 <- forecast_vol - realized
e2 <- implied - realized
dm <- function(...) { r <- dm.test(e1, e2, ...); list(statistic = unname(r$statistic), p_value = r$p.value) }
dm_cases <- list(
  bartlett_h5_power2 = c(dm(h = 5, power = 2, varestimator = "bartlett"), h = 5, power = 2, varestimator = "bartlett"),
  bartlett_h5_power1 = c(dm(h = 5, power = 1, varestimator = "bartlett"), h = 5, power = 1, varestimator = "bartlett"),
  bartlett_h21_power2 = c(dm(h = 21, power = 2, varestimator = "bartlett"), h = 21, power = 2, varestimator = "bartlett"),
  acf_h5_power2 = c(dm(h = 5, power = 2, varestimator = "acf"), h = 5, power = 2, varestimator = "acf"),
  acf_h1_power2 = c(dm(h = 1, power = 2, varestimator = "acf"), h = 1, power = 2, varestimator = "acf"))
# The rectangular ("acf") long-run variance for the h = 5 case, to show it was positive (no fallback in R).
d <- e1^2 - e2^2
g <- acf(d, lag.max = 4, type = "covariance", plot = FALSE)$acf[, , 1]

out <- list(
  r_version = R.version.string,
  sandwich_version = as.character(packageVersion("sandwich")),
  lmtest_version = as.character(packageVersion("lmtest")),
  forecast_version = as.character(packageVersion("forecast")),
  seed = 20240604, n = n, h = h,
  mincer_zarnowitz = list(
    coefficients = unname(coef(mz)), hac_lag = h - 1, hac_covariance = as.vector(unname(mz_cov)),
    wald = mz_wald, wald_p = pchisq(mz_wald, df = 2, lower.tail = FALSE),
    r_squared = summary(mz)$r.squared,
    hac_covariance_lag0 = as.vector(unname(mz_cov0)), hac_covariance_lag12 = as.vector(unname(mz_cov12))),
  encompassing = list(
    coefficients = unname(coef(enc)), hac_lag = h - 1, hac_covariance = as.vector(unname(enc_cov)),
    t = unname(enc_ct[, "t value"]), p = unname(enc_ct[, "Pr(>|t|)"]), r_squared = summary(enc)$r.squared),
  diebold_mariano = dm_cases,
  dm_rectangular_variance_h5 = sum(c(g[1], 2 * g[-1])))
writeLines(toJSON(out, auto_unbox = TRUE, digits = NA, pretty = TRUE), "scoring-reference.json")
