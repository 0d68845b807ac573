// Every model family of the core (one header a family, under models/).
#ifndef CTO_MODELS_HPP
#define CTO_MODELS_HPP

#include "models/alternating.hpp"
#include "models/combined.hpp"
#include "models/deadline.hpp"
#include "models/incomplete.hpp"
#include "models/parties.hpp"
#include "models/rates.hpp"
#include "models/offers.hpp"
#include "models/trade.hpp"
#include "models/utility.hpp"

#endif  // CTO_MODELS_HPP
