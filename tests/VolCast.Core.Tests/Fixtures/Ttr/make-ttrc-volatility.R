# Produces ttrc-volatility.csv: TTR's own daily OHLC sample data (data(ttrc), 5,550 rows) and
# TTR::volatility() for every calc this project implements, at n = 10 and n = 20, N = 252.
# Run from this folder with Debian's R and r-cran-ttr:  Rscript make-ttrc-volatility.R
# Numbers are written with 17 significant digits so that every double round-trips exactly.
suppressPackageStartupMessages(library(TTR))
data(ttrc)
ohlc <- as.matrix(ttrc[, c("Open", "High", "Low", "Close")])
calcs <- c("close", "parkinson", "garman.klass", "rogers.satchell", "yang.zhang")
windows <- c(10, 20)
fmt <- function(x) ifelse(is.na(x), "", sprintf("%.17g", x))
out <- data.frame(date = format(ttrc$Date, "%Y-%m-%d"),
                  open = fmt(ttrc$Open), high = fmt(ttrc$High),
                  low = fmt(ttrc$Low), close = fmt(ttrc$Close),
                  stringsAsFactors = FALSE)
for (n in windows) {
  for (calc in calcs) {
    v <- as.numeric(volatility(ohlc, n = n, calc = calc, N = 252))
    out[[paste0(gsub(".", "_", calc, fixed = TRUE), "_", n)]] <- fmt(v)
  }
}
con <- file("ttrc-volatility.csv", open = "w")
writeLines(c(
  sprintf("# %s; TTR %s (Debian r-cran-ttr); xts %s", R.version.string,
          as.character(packageVersion("TTR")), as.character(packageVersion("xts"))),
  "# Source data: TTR data(ttrc), daily OHLC, 5,550 rows. Columns <calc>_<n> = TTR::volatility(OHLC, n, calc, N = 252); empty = NA.",
  "# Produced by make-ttrc-volatility.R in this folder."), con)
write.csv(out, con, row.names = FALSE, quote = FALSE)
close(con)
