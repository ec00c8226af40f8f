// sheetmill's executable: everything it does is in the library (sheetmill/app/app.hpp).
#include "sheetmill/app/app.hpp"

int main(int argc, char** argv) {
  return sheetmill::app::run(argc, argv);
}
