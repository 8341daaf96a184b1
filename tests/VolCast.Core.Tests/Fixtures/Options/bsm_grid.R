# Reference prices for the Black-Scholes-Merton tests, computed with R's own normal distribution
# function (pnorm, an implementation independent of the one VolCast uses).
# Run from this folder: Rscript bsm_grid.R > bsm_grid.csv
bs <- function(type, S, K, r, q, sigma, T) {
  sd <- sigma * sqrt(T)
  d1 <- (log(S / K) + (r - q + sigma^2 / 2) * T) / sd
  d2 <- d1 - sd
  if (type == "call") {
    S * exp(-q * T) * pnorm(d1) - K * exp(-r * T) * pnorm(d2)
  } else {
    K * exp(-r * T) * pnorm(-d2) - S * exp(-q * T) * pnorm(-d1)
  }
}
cat(sprintf("# %s; base R only (stats::pnorm)\n", R.version.string))
cat("type,spot,strike,years,rate,dividend_yield,volatility,price\n")
S <- 100
for (type in c("call", "put"))
  for (K in c(50, 70, 90, 100, 110, 130, 150, 200))
    for (days in c(1, 7, 30, 91, 365, 1095))
      for (sigma in c(0.1, 0.3, 0.8))
        for (rq in list(c(0.05, 0.02), c(0, 0))) {
          T <- days / 365
          p <- bs(type, S, K, rq[1], rq[2], sigma, T)
          cat(sprintf("%s,%.17g,%.17g,%.17g,%.17g,%.17g,%.17g,%.17g\n", type, S, K, T, rq[1], rq[2], sigma, p))
        }
